/**
 * Set-up file of the mutation run when test files share one module registry (MUTATE_NO_ISOLATE=1,
 * see vitest.mutation.config.ts). It forgets the remembered grids before each test file and before
 * each test, so
 * - no file is answered from grids (and the required-voltage and carry-weight caches keyed by them)
 *   built while another planted bug was active, and
 * - every test that checks a setup builds its own grids: StrykerJS's per-test coverage then counts
 *   that test as covering the grid, required-voltage and sweep code, and runs it against those
 *   mutants. With the caches kept between tests only the first test of a file would run that code,
 *   and a mutant there would be judged by that one test alone.
 */
import { beforeEach } from 'vitest';
import { forgetLastGrids } from '../../electron/checker/grid.js';

forgetLastGrids();
beforeEach(() => {
  forgetLastGrids();
});
