import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    pool: 'forks',
    // A page on a loaded 2-core machine can take seconds to answer; expect.poll waits up to this long.
    expect: { poll: { timeout: 15_000, interval: 100 } },
    reporters: ['default'],
  },
});
