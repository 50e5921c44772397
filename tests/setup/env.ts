// Runs before every test file (vitest isolates modules per file): each file gets its own SQLite database, a copy
// of the migrated template that tests/setup/global-db.ts built for this run.
import { copyFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { inject } from 'vitest';

const dir = mkdtempSync(join(tmpdir(), 'wakebook-test-'));
process.env.WAKEBOOK_DB = join(dir, 'test.db');
process.env.WAKEBOOK_UPLOADS = join(dir, 'uploads');
process.env.WAKEBOOK_DEMO = '0';
delete process.env.SMTP_URL;
copyFileSync(join(inject('templateDir'), 'migrated.db'), process.env.WAKEBOOK_DB);
