/// <reference types="vitest/config" />
import { getViteConfig } from 'astro/config';

// Unit, API and reference suites. Browser tests live in vitest.e2e.config.ts (they need a built server).
export default getViteConfig({
  test: {
    include: ['tests/unit/**/*.test.ts', 'tests/api/**/*.test.ts', 'tests/reference/**/*.test.ts'],
    globalSetup: ['tests/setup/global-db.ts'],
    setupFiles: ['tests/setup/env.ts', 'tests/setup/content.ts'],
    pool: 'forks',
    testTimeout: 20_000,
    hookTimeout: 30_000,
  },
});
