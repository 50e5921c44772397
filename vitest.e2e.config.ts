import { defineConfig } from 'vitest/config';

// Browser tests drive Debian's /usr/bin/chromium against the built server (npm run build first).
export default defineConfig({
  test: {
    include: ['tests/e2e/**/*.test.ts'],
    globalSetup: ['tests/e2e/global-setup.ts'],
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 90_000,
  },
});
