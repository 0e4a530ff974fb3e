/**
 * The vitest run that StrykerJS uses (`npm run mutate`, stryker.config.json): only the in-process
 * tests of the checker and the checklist, so each mutant is judged in seconds. Left out on purpose:
 * the command line (a child process, which Stryker's coverage cannot see), the ngspice reference
 * runs and the browser and store tests (slow, and they reach the checker only through those), and
 * the few files listed under `exclude` below, each with its reason.
 * CI=true fixes the fast-check seed (see test/checker/properties.test.ts), so a mutant is judged
 * by the same cases each time.
 */
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    root: new URL('../..', import.meta.url).pathname,
    // MUTATE_CHECKER_TESTS=1 runs the checker's tests alone (when only checker files are mutated):
    // the checklist tests build every demo sheet when they load, which makes each checker mutant
    // "static" as well and so much slower to judge, and they add few kills there.
    include: process.env.MUTATE_CHECKER_TESTS === '1' ? ['test/checker/**/*.test.ts'] : ['test/checker/**/*.test.ts', 'test/checklist/**/*.test.ts'],
    exclude: [
      '**/node_modules/**',
      // Scratch files a developer may leave while working.
      'test/checker/zz-*.test.ts',
      // They read the source text, which Stryker has rewritten (it adds a global), so they cannot pass there.
      'test/checker/purity.test.ts',
      'test/checklist/purity.test.ts',
      // Thousands of whole-setup checks each (10 000 fast-check runs per law, every combination of
      // generated bins): on Stryker's instrumented code, about ten times slower, they would make a
      // full run take most of a day. They stay in npm test; the targeted mutants-*.test.ts files
      // cover the same code with small rpm grids.
      'test/checker/properties.test.ts',
      'test/checker/search-equivalence.test.ts',
      'test/checker/advice.test.ts',
    ],
    env: { CI: 'true' },
    // MUTATE_NO_ISOLATE=1 shares one module registry between test files and runs (about three times
    // faster on this machine). grid.ts (the last grids), session.ts (required voltages) and
    // sweep.ts (carry weights) keep results between calls, which a mutant could leave behind for
    // the next run.
    // With it, forget-grids.ts runs before each test file and drops the remembered grids (the other two
    // caches are keyed by them), so grid.ts, session.ts and sweep.ts can be mutated that way too.
    isolate: process.env.MUTATE_NO_ISOLATE !== '1',
    setupFiles: process.env.MUTATE_NO_ISOLATE === '1' ? ['test/mutation/forget-grids.ts'] : [],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    pool: 'forks',
    reporters: ['default'],
  },
});
