import { describe, it, expect } from 'vitest';
import { parseSettings, SettingsError } from '../../src/lib/server/config';

describe('settings', () => {
  it('has defaults that run a local server', () => {
    const s = parseSettings({});
    expect(s).toMatchObject({
      HOST: '127.0.0.1',
      PORT: 4321,
      WAKEBOOK_DB: 'data/wakebook.db',
      WAKEBOOK_UPLOADS: 'data/uploads',
      WAKEBOOK_DEMO: false,
    });
    expect(s.SMTP_URL).toBeUndefined();
  });

  it('reads the demo flag and trims a trailing slash from PUBLIC_URL', () => {
    const s = parseSettings({ WAKEBOOK_DEMO: '1', PUBLIC_URL: 'https://wakebook.example.org/' });
    expect(s.WAKEBOOK_DEMO).toBe(true);
    expect(s.PUBLIC_URL).toBe('https://wakebook.example.org');
  });

  it('accepts a long cron token and a sender address, and leaves both unset by default', () => {
    expect(parseSettings({}).WAKEBOOK_CRON_TOKEN).toBeUndefined();
    const s = parseSettings({
      WAKEBOOK_CRON_TOKEN: 'a'.repeat(32),
      MAIL_FROM: 'Northmere Wakebook <team@northmere.example>',
    });
    expect(s.WAKEBOOK_CRON_TOKEN).toBe('a'.repeat(32));
    expect(s.MAIL_FROM).toBe('Northmere Wakebook <team@northmere.example>');
  });

  it.each([
    [{ PORT: 'eighty' }, 'PORT'],
    [{ PORT: '70000' }, 'PORT'],
    [{ WAKEBOOK_DEMO: 'maybe' }, 'WAKEBOOK_DEMO'],
    [{ SMTP_URL: 'mail.example.org' }, 'SMTP_URL'],
    [{ PUBLIC_URL: 'ftp://x' }, 'PUBLIC_URL'],
    [{ WAKEBOOK_CRON_TOKEN: 'too-short' }, 'WAKEBOOK_CRON_TOKEN'],
    [{ MAIL_FROM: 'no address here' }, 'MAIL_FROM'],
  ])('stops with a message naming the bad setting %o', (env, name) => {
    expect(() => parseSettings(env)).toThrow(SettingsError);
    expect(() => parseSettings(env)).toThrow(new RegExp(`cannot start[\\s\\S]*${name}`));
  });
});
