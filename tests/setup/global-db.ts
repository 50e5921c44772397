// Vitest global setup: migrating a database and seeding the demo into it cost about a second per test file, so
// they run once per `npm test` and every file copies the result (tests/setup/env.ts, tests/setup/db.ts).
// The seed runs in a child process through tsx: it imports the server modules as the app does, and leaves
// nothing (open handles, settings, environment) behind in Vitest's main process.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';

declare module 'vitest' {
  export interface ProvidedContext {
    /** Holds migrated.db (migrations applied) and demo.db + demo-uploads/ (the demo team seeded). */
    templateDir: string;
  }
}

export default function setup(project: TestProject) {
  const dir = mkdtempSync(join(tmpdir(), 'wakebook-templates-'));
  execFileSync(process.execPath, ['--import', 'tsx', 'tests/setup/build-templates.ts', dir], { stdio: 'inherit' });
  project.provide('templateDir', dir);
  return () => rmSync(dir, { recursive: true, force: true });
}
