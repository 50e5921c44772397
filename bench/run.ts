// npm run bench [-- --json] [--only http,calc,search,import] [--seconds 8]
// Prints one JSON object a line with --json: {"name", "n", "p50_ms", "p99_ms", "ops_per_s"?, ...}.
import { existsSync } from 'node:fs';

const args = process.argv.slice(2);
const asJson = args.includes('--json');
const onlyArg = args.find((a) => a.startsWith('--only'));
const only = onlyArg
  ? (onlyArg.includes('=') ? onlyArg.split('=')[1] : args[args.indexOf(onlyArg) + 1]).split(',')
  : null;
const secondsArg = args.indexOf('--seconds');
const seconds = secondsArg >= 0 ? Number(args[secondsArg + 1]) : undefined;

const suites: Record<string, () => Promise<object[]>> = {
  calc: async () => (await import('./calc')).default(),
  http: async () => (await import('./http')).default({ seconds }),
  search: async () => (await import('./search')).default(),
  import: async () => (await import('./import')).default(),
};

for (const [name, run] of Object.entries(suites)) {
  if (only && !only.includes(name)) continue;
  if ((name === 'http' || name === 'import') && !existsSync('dist/server/entry.mjs')) {
    console.error(`bench: skipping ${name} (run \`npm run build\` first)`);
    continue;
  }
  if (!asJson) console.log(`\n# ${name}`);
  for (const row of await run()) console.log(asJson ? JSON.stringify(row) : row);
}
