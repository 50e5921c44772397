import { describe, it, expect } from 'vitest';
import { isCronRequest } from '../../src/lib/server/cron-auth';

const SECRET = 's3cret-'.repeat(6);
const req = (authorization?: string) =>
  new Request('http://localhost/api/digest/send', { method: 'POST', headers: authorization ? { authorization } : {} });

describe('isCronRequest', () => {
  it('accepts exactly the configured bearer secret', () => {
    expect(isCronRequest(req(`Bearer ${SECRET}`), SECRET)).toBe(true);
  });
  it.each([
    ['no header', undefined],
    ['another secret', `Bearer ${SECRET}x`],
    ['a prefix of it', `Bearer ${SECRET.slice(0, 10)}`],
    ['no scheme', SECRET],
    ['another scheme', `Basic ${SECRET}`],
    ['empty bearer', 'Bearer '],
  ])('refuses %s', (_, header) => {
    expect(isCronRequest(req(header), SECRET)).toBe(false);
  });
  it('refuses everything when no secret is configured', () => {
    expect(isCronRequest(req('Bearer '), undefined)).toBe(false);
    expect(isCronRequest(req(`Bearer ${SECRET}`), undefined)).toBe(false);
  });
});
