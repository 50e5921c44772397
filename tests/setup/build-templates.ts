// Run once per `npm test` by global-db.ts (in its own process, through tsx): builds the two template databases
// that every test file copies. Argument: the folder to build them in.
import { join } from 'node:path';
import { closeDatabase, db, openDatabase } from '../../src/lib/server/db/client';
import { seedDemoIfEmpty } from '../../src/lib/server/demo/seed';

const dir = process.argv[2];
if (!dir) throw new Error('usage: build-templates.ts <folder>');

// Closing a WAL database checkpoints it, so each template is one self-contained file.
openDatabase(join(dir, 'migrated.db')).$client.close();

process.env.WAKEBOOK_DB = join(dir, 'demo.db');
process.env.WAKEBOOK_UPLOADS = join(dir, 'demo-uploads');
process.env.WAKEBOOK_DEMO = '0';
delete process.env.SMTP_URL;
await seedDemoIfEmpty();
db().$client.pragma('wal_checkpoint(TRUNCATE)');
closeDatabase();
