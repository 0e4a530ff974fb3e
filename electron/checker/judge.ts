/**
 * The verdict-only pass of the parts-bin search: one prepared combination is swept into a reused
 * workspace and each rule's fail test is asked, with no figures or sentences built. It reads the
 * same sweep columns and the same worst reserve as `analyse`, so a combination fails here exactly
 * when its full report has a failing rule; full reports are built only for the combinations the
 * search returns.
 */
import { FAIL_TESTS } from './rules/index.js';
import { OFF_TIME_FAIL_RATIO } from './rules/spark.js';
import type { Baseline, RuleContext } from './rules/context.js';
import type { PreparedSetup } from './prepare.js';
import { gapOf, requiredFor, ruleContext, worstReserve, type Session } from './session.js';
import { evaluateGrid, type SweepScope, type Workspace } from './sweep.js';
import type { KeyOnReport } from './types.js';

/** The sweep scopes of the verdict-only pass: no fouled-plug column (only the report reads it). */
const VERDICT: SweepScope = { verdictOnly: true, offTimeFailRatio: OFF_TIME_FAIL_RATIO };
const VERDICT_CRANKING: SweepScope = { verdictOnly: true, crankingOnly: true, offTimeFailRatio: OFF_TIME_FAIL_RATIO };

export interface Judgement {
  /** Lowest reserve ratio from cranking to redline. */
  worstRatio: number;
  /** Whether any rule fails. */
  fails: boolean;
  /** What the fail tests were given (the search asks the tach test again with another tach). */
  ctx: RuleContext;
}

/**
 * Judge `prep` (its key-on state already worked out) into `ws`; `failed[k]` is set to 1 when
 * rule `FAIL_TESTS[k]` fails and 0 otherwise. `scope.crankingOnly` passes through to the sweep
 * (the search's cranking-bypass twin recomputes only the cranking points); the sweep always leaves
 * out the columns only a report reads (`verdictOnly`).
 */
export function judge(s: Session, prep: PreparedSetup, keyOn: KeyOnReport, baseline: Baseline | null, ws: Workspace, failed: Uint8Array, scope?: SweepScope): Judgement {
  const setup = prep.spec;
  const gapM = gapOf(setup, prep);
  evaluateGrid(prep, s.grids.sweep, gapM, ws, requiredFor(s, gapM, prep.polarityFactor), scope?.crankingOnly === true ? VERDICT_CRANKING : VERDICT);
  const { worstRatio, worstIndex } = worstReserve(ws, s.grids.redlineIndex);
  const ctx = ruleContext(s, setup, prep, gapM, ws, keyOn, baseline, null, worstRatio, worstIndex);
  let fails = false;
  for (let k = 0; k < FAIL_TESTS.length; k++) {
    const f = FAIL_TESTS[k]![1](ctx);
    failed[k] = f ? 1 : 0;
    if (f) fails = true;
  }
  return { worstRatio, fails, ctx };
}
