import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    pool: 'forks',
    // two workers on the 2-core machines this project runs on (the default leaves one core idle);
    // many suites wait on spawned CLI processes or Chromium, so both cores stay busy
    maxWorkers: 2,
  },
});
