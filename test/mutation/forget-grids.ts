/**
 * Set-up file of the mutation run when test files share one module registry (MUTATE_NO_ISOLATE=1,
 * see vitest.mutation.config.ts): vitest runs it before each test file, so no file is answered from
 * grids (and the caches keyed by them) built while another planted bug was active.
 */
import { forgetLastGrids } from '../../electron/checker/grid.js';

forgetLastGrids();
