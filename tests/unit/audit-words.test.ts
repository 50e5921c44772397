import { describe, it, expect } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { actionInWords } from '../../src/lib/audit-words';

// Every action the server writes to the audit log reads as words on /admin/audit, never as its dotted name.
const dir = 'src/lib/server';
const files = readdirSync(dir, { recursive: true })
  .map(String)
  .filter((f) => f.endsWith('.ts'));
const actions = new Set<string>();
for (const f of files)
  for (const m of readFileSync(join(dir, f), 'utf8').matchAll(/action: '([a-z]+\.[a-z.-]+)'/g)) actions.add(m[1]);

describe('audit actions in words', () => {
  it('finds the actions the server records', () => expect(actions.size).toBeGreaterThan(30));
  it.each([...actions])('%s has words of its own', (action) => {
    expect(actionInWords(action)).not.toBe(action.replace(/[.:-]/g, ' '));
  });
});
