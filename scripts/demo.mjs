// `npm run demo`: serves the built app with the fictional demo team seeded into an empty database.
import { existsSync } from 'node:fs';

process.env.WAKEBOOK_DEMO ??= '1';
process.env.HOST ??= '127.0.0.1';
process.env.PORT ??= '4321';
process.env.ASTRO_TELEMETRY_DISABLED ??= '1';

if (!existsSync('dist/prepare/prepare.mjs')) {
  console.error('No build found: run `npm run build` first (npm run demo does this for you).');
  process.exit(1);
}

await import('./start.mjs');

const url = `http://localhost:${process.env.PORT}`;
console.log(`
Wakebook demo is running at ${url}
Sign in with any of these accounts (password: wakebook-demo):
  lead@wakebook.test      team lead: everything, including admin
  advisor@wakebook.test   advisor: reads all, reviews records, curates onboarding
  member@wakebook.test    member: writes decision records, lessons and calculations
  alumni@wakebook.test    alumni: reads all, answers questions in comments
Database: ${process.env.WAKEBOOK_DB ?? 'data/wakebook.db'} (delete it to start the demo afresh). Stop with Ctrl+C.
`);
