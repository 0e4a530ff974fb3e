/**
 * What every rule sees: the inputs, the prepared circuit and the sweep results. Rules only read.
 */
import type { RpmGrid } from '../grid.js';
import { sparkEnergyAt } from '../report-figures.js';
import type { PreparedSetup } from '../prepare.js';
import type { Workspace } from '../sweep.js';
import type { EngineSpec, Figure, Intent, KeyOnReport, PlugGapSuggestion, ResolvedConditions, RuleId, RuleResult, SetupSpec, Verdict } from '../types.js';

/** What a candidate is compared with: the existing setup across the same rpm grid. */
export interface Baseline {
  label: string;
  /** Stored energy per sweep point (0.5 L i^2 or 0.5 C V^2). */
  energyJ: Float64Array;
  /** Energy delivered to the spark per sweep point (what the spark-energy rule compares). */
  sparkEnergyJ: Float64Array;
  /** Spark duration per sweep point (from a full sweep, never NaN). */
  durationS: Float64Array;
  worstRatio: number;
}

/** A baseline from a setup's full sweep (`ws` with every column, its prepared circuit `p`). */
export function baselineFrom(label: string, p: PreparedSetup, ws: Workspace, worstRatio: number): Baseline {
  const n = ws.energyJ.length;
  const sparkEnergyJ = new Float64Array(n);
  for (let i = 0; i < n; i++) sparkEnergyJ[i] = sparkEnergyAt(p, ws, i);
  return { label, energyJ: ws.energyJ.slice(), sparkEnergyJ, durationS: ws.durationS.slice(), worstRatio };
}

export interface RuleContext {
  engine: EngineSpec;
  c: ResolvedConditions;
  setup: SetupSpec;
  p: PreparedSetup;
  grid: RpmGrid;
  ws: Workspace;
  /** Last sweep index at or below redline. */
  redlineIndex: number;
  /** First sweep index at or above idle. */
  idleIndex: number;
  keyOn: KeyOnReport;
  margin: number;
  baseline: Baseline | null;
  gap: PlugGapSuggestion | null;
  /** Lowest reserve ratio over cranking..redline and its index. */
  worstRatio: number;
  worstIndex: number;
}

export type Rule = (ctx: RuleContext) => RuleResult;

/**
 * Whether a rule's verdict is 'fail', decided without building its figures or sentences. Every
 * rule has one beside it, on the same limits; the parts-bin search asks it of thousands of
 * combinations and builds full results only for the few it reports.
 */
export type FailTest = (ctx: RuleContext) => boolean;

export function result(id: RuleId, title: string, verdict: Verdict, figures: Figure[], why: string, action: string, intents?: Intent[]): RuleResult {
  return intents && intents.length > 0 ? { id, title, verdict, figures, why, action, intents } : { id, title, verdict, figures, why, action };
}

/** A figure, forced finite so that no report ever carries NaN or Infinity. */
export function fig(name: string, value: number, unit: string): Figure {
  return { name, value: Number.isFinite(value) ? value : 0, unit };
}

/** Plain number formatting for sentences. */
export function fmt(x: number, digits = 1): string {
  return Number.isFinite(x) ? x.toFixed(digits) : '-';
}

export const isModuleKind = (ctx: RuleContext): boolean => ctx.setup.module !== null && ctx.p.kind !== 'points' && ctx.p.kind !== 'magneto';

/** Largest value of a column over [from, to]. */
export function maxOver(a: Float64Array, from: number, to: number): { value: number; index: number } {
  let v = -Infinity;
  let idx = from;
  for (let i = from; i <= to; i++) if (a[i]! > v) { v = a[i]!; idx = i; }
  return { value: v, index: idx };
}

/** Smallest value of a column over [from, to]. */
export function minOver(a: Float64Array, from: number, to: number): { value: number; index: number } {
  let v = Infinity;
  let idx = from;
  for (let i = from; i <= to; i++) if (a[i]! < v) { v = a[i]!; idx = i; }
  return { value: v, index: idx };
}
