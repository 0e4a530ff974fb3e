/**
 * Every rule the checker reports, in the order the report shows them. To add a rule: write it as a
 * `Rule` in one of these files (or a new one), add its id to `RuleId` in ../types.ts, and list it here;
 * write its `FailTest` beside it (true exactly when the rule's verdict is 'fail') and list that too.
 */
import type { RuleId, RuleResult, Verdict } from '../types.js';
import type { FailTest, Rule, RuleContext } from './context.js';
import { ballastPlan, ballastPlanFails, coilResistanceFloor, coilResistanceFloorFails, peakCurrent, peakCurrentFails } from './resistance.js';
import { crankingSupply, crankingSupplyFails, earthPolarity, earthPolarityFails, moduleSupplyMax, moduleSupplyMaxFails, sixVolt, sixVoltFails } from './supply.js';
import { coilPolarity, coilPolarityFails } from './polarity.js';
import { totalAdvance, totalAdvanceFails } from './advance.js';
import { tachFails, tachRule } from './tach.js';
import { offTime, offTimeFails, plugGap, plugGapFails, sparkEnergy, sparkEnergyFails, sparkRate, sparkRateFails, voltageReserve, voltageReserveFails } from './spark.js';
import { keyOnHeat, keyOnHeatFails, moduleHeat, moduleHeatFails } from './heat.js';
import { condenser, condenserFails, setupComplete, setupCompleteFails, suppressedLeads, suppressedLeadsFails } from './wiring.js';

export const RULES: readonly Rule[] = [
  setupComplete,
  earthPolarity,
  coilResistanceFloor,
  peakCurrent,
  ballastPlan,
  crankingSupply,
  moduleSupplyMax,
  keyOnHeat,
  sixVolt,
  voltageReserve,
  sparkEnergy,
  sparkRate,
  offTime,
  plugGap,
  totalAdvance,
  coilPolarity,
  condenser,
  suppressedLeads,
  tachRule,
  moduleHeat,
];

/**
 * Each rule's fail test, in the same order as RULES (test/checker/search-equivalence.test.ts holds
 * every test to its rule's verdict). The parts-bin search judges combinations with these alone.
 */
export const FAIL_TESTS: ReadonlyArray<readonly [RuleId, FailTest]> = [
  ['setup-complete', setupCompleteFails],
  ['earth-polarity', earthPolarityFails],
  ['coil-resistance-floor', coilResistanceFloorFails],
  ['peak-current', peakCurrentFails],
  ['ballast-plan', ballastPlanFails],
  ['cranking-supply', crankingSupplyFails],
  ['module-supply-max', moduleSupplyMaxFails],
  ['key-on-heat', keyOnHeatFails],
  ['six-volt', sixVoltFails],
  ['voltage-reserve', voltageReserveFails],
  ['spark-energy', sparkEnergyFails],
  ['spark-rate', sparkRateFails],
  ['off-time', offTimeFails],
  ['plug-gap', plugGapFails],
  ['total-advance', totalAdvanceFails],
  ['coil-polarity', coilPolarityFails],
  ['condenser', condenserFails],
  ['suppressed-leads', suppressedLeadsFails],
  ['tach', tachFails],
  ['module-heat', moduleHeatFails],
];

/**
 * Rules whose verdict another tachometer can change: the tach rule alone (a tachometer changes no
 * other input). The parts-bin search tries the shelf's tachs only where nothing else fails.
 */
export const TACH_RULES: ReadonlySet<RuleId> = new Set<RuleId>(['tach']);

/**
 * Rules whose verdict other HT leads or plugs can change: the suppression they give, and the
 * secondary resistance they add (spark duration, the CD transfer loop, the damped peak, and so the
 * reserve). Every other rule reads only the primary side, the module and the engine.
 * search-equivalence.test.ts holds the search, which relies on this list, to trying every variant.
 */
export const LEADS_PLUG_RULES: ReadonlySet<RuleId> = new Set<RuleId>(['suppressed-leads', 'voltage-reserve', 'spark-energy', 'off-time', 'plug-gap', 'coil-polarity']);

export function runRules(ctx: RuleContext): RuleResult[] {
  return RULES.map((r) => r(ctx));
}

const RANK: Record<Verdict, number> = { pass: 0, caution: 1, fail: 2 };

export function worstVerdict(results: readonly RuleResult[]): Verdict {
  let w: Verdict = 'pass';
  for (const r of results) if (RANK[r.verdict] > RANK[w]) w = r.verdict;
  return w;
}

export type { FailTest, RuleContext } from './context.js';
