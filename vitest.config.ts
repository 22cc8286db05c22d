import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    pool: 'forks',
    // test files share their worker's module graph instead of re-importing the sources per file
    // (about a fifth of the suite's CPU went to transforms and imports); no test changes the
    // working directory, the environment or module mocks, and the core's caches never change a result
    isolate: false,
    // two workers on the 2-core machines this project runs on (the default leaves one core idle);
    // many suites wait on spawned CLI processes or Chromium, so both cores stay busy
    maxWorkers: 2,
    // one temporary folder for the whole run, removed at its end (tests/helpers/scratchRoot.ts)
    globalSetup: ['tests/helpers/scratchRoot.ts'],
  },
});
