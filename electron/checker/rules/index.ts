/**
 * Every rule the checker reports, in the order the report shows them. To add a rule: write it as a
 * `Rule` in one of these files (or a new one), add its id to `RuleId` in ../types.ts, and list it here.
 */
import type { RuleResult, Verdict } from '../types.js';
import type { Rule, RuleContext } from './context.js';
import { ballastPlan, coilResistanceFloor, peakCurrent } from './resistance.js';
import { crankingSupply, earthPolarity, sixVolt } from './supply.js';
import { coilPolarity } from './polarity.js';
import { tachRule } from './tach.js';
import { offTime, plugGap, sparkEnergy, sparkRate, voltageReserve } from './spark.js';
import { keyOnHeat, moduleHeat } from './heat.js';
import { condenser, setupComplete, suppressedLeads } from './wiring.js';

export const RULES: readonly Rule[] = [
  setupComplete,
  earthPolarity,
  coilResistanceFloor,
  peakCurrent,
  ballastPlan,
  crankingSupply,
  keyOnHeat,
  sixVolt,
  voltageReserve,
  sparkEnergy,
  sparkRate,
  offTime,
  plugGap,
  coilPolarity,
  condenser,
  suppressedLeads,
  tachRule,
  moduleHeat,
];

export function runRules(ctx: RuleContext): RuleResult[] {
  return RULES.map((r) => r(ctx));
}

const RANK: Record<Verdict, number> = { pass: 0, caution: 1, fail: 2 };

export function worstVerdict(results: readonly RuleResult[]): Verdict {
  let w: Verdict = 'pass';
  for (const r of results) if (RANK[r.verdict] > RANK[w]) w = r.verdict;
  return w;
}

export type { RuleContext } from './context.js';
