/**
 * A check session: one engine under one set of conditions, with its rpm grids built once. Each
 * setup is then prepared, swept and judged against it.
 */
import { gridsFor, type EngineGrids } from './grid.js';
import { keyOnReport } from './keyon.js';
import { prepareSetup, type PreparedSetup } from './prepare.js';
import { resolveConditions } from './conditions.js';
import { createWorkspace, evaluateGrid, requiredInto, type Workspace } from './sweep.js';
import { suggestGap } from './gap.js';
import { runRules, worstVerdict } from './rules/index.js';
import { baselineFrom, type Baseline, type RuleContext } from './rules/context.js';
import type { BreakdownModel, CheckOptions, ConditionInputs, EngineSpec, KeyOnReport, PlugGapSuggestion, ResolvedConditions, RuleResult, SetupSpec, Verdict } from './types.js';

export interface Session {
  engine: EngineSpec;
  conditions: ResolvedConditions;
  grids: EngineGrids;
  model: BreakdownModel;
  margin: number;
  options: CheckOptions;
  /** Required voltage on the sweep grid, by gap and polarity factor, computed once each. */
  requiredCache: Map<string, Float64Array>;
  /** The entry asked for last. */
  lastRequired: { gapM: number; polarityFactor: number; values: Float64Array } | null;
}

/** Required voltage across the sweep for a gap and polarity factor, shared between setups. */
export function requiredFor(s: Session, gapM: number, polarityFactor: number): Float64Array {
  // The search asks for the same gap thousands of times in a row: answer that without a key string.
  const last = s.lastRequired;
  if (last && last.gapM === gapM && last.polarityFactor === polarityFactor) return last.values;
  const key = `${gapM}|${polarityFactor}`;
  let a = s.requiredCache.get(key);
  if (!a) {
    a = new Float64Array(s.grids.sweep.n);
    requiredInto(a, s.grids.sweep, gapM, s.model === 'paschen', polarityFactor);
    if (s.requiredCache.size > 64) s.requiredCache.clear();
    s.requiredCache.set(key, a);
  }
  s.lastRequired = { gapM, polarityFactor, values: a };
  return a;
}

/**
 * Required-voltage arrays by grids and law: the grids are shared between sessions on the same
 * engine and conditions (grid.ts `gridsFor`), and so are these, which depend on nothing else.
 */
const requiredCaches = new WeakMap<EngineGrids, { air: Map<string, Float64Array>; paschen: Map<string, Float64Array> }>();
function requiredCacheOf(grids: EngineGrids, model: BreakdownModel): Map<string, Float64Array> {
  let c = requiredCaches.get(grids);
  if (!c) {
    c = { air: new Map(), paschen: new Map() };
    requiredCaches.set(grids, c);
  }
  return model === 'paschen' ? c.paschen : c.air;
}

export function createSession(engine: EngineSpec, conditions?: ConditionInputs, options?: CheckOptions): Session {
  const c = resolveConditions(engine, conditions);
  const opts = options ?? {};
  const margin = c.marginRatio.value > 0 ? c.marginRatio.value : 1.25;
  const grids = gridsFor(engine, c, opts.rpmPoints ?? 200);
  const model = opts.breakdownModel ?? 'empirical-air';
  return {
    engine,
    conditions: c,
    grids,
    model,
    margin,
    options: opts,
    requiredCache: requiredCacheOf(grids, model),
    lastRequired: null,
  };
}

export interface Analysis {
  setup: SetupSpec;
  prep: PreparedSetup;
  ws: Workspace;
  keyWs: Workspace;
  keyOn: KeyOnReport;
  /** What the rules were given. */
  ctx: RuleContext;
  rules: RuleResult[];
  verdict: Verdict;
  worstRatio: number;
  worstIndex: number;
  belowMarginIndex: number;
  gap: PlugGapSuggestion | null;
}

/** A usable gap: positive and finite, else 0.7 mm (and the setup-complete rule says so). */
export function gapOf(setup: SetupSpec, prep: PreparedSetup): number {
  if (Number.isFinite(setup.plugGapM) && setup.plugGapM > 0) return setup.plugGapM;
  prep.issues.push('The plug gap is missing or not positive; 0.7 mm was assumed.');
  return 0.7e-3;
}

/** Sweep a setup and judge it. `ws`/`keyWs` may be reused between calls (the search does). */
export function analyse(s: Session, setup: SetupSpec, baseline: Baseline | null, withGap: boolean, ws?: Workspace, keyWs?: Workspace): Analysis {
  const prep = prepareSetup(s.engine, setup, s.conditions, s.model);
  const gapM = gapOf(setup, prep);
  const sweep = s.grids.sweep;
  const w = ws ?? createWorkspace(sweep.n);
  const k = keyWs ?? createWorkspace(s.grids.key.n);
  evaluateGrid(prep, sweep, gapM, w, requiredFor(s, gapM, prep.polarityFactor));
  evaluateGrid(prep, s.grids.key, gapM, k);
  const last = s.grids.redlineIndex;
  const { worstRatio, worstIndex } = worstReserve(w, last);
  let belowMarginIndex = -1;
  for (let i = 1; i < sweep.n; i++) {
    if (sweep.rpm[i]! >= s.engine.idleRpm && w.reserveRatio[i]! < s.margin) { belowMarginIndex = i; break; }
  }
  const keyOn = keyOnReport(prep, s.conditions);
  const gap = withGap ? suggestGap(sweep, w.availableV, last, setup.plug, s.margin, s.model === 'paschen', prep.polarityFactor, worstIndex) : null;
  const ctx = ruleContext(s, setup, prep, gapM, w, keyOn, baseline, gap, worstRatio, worstIndex);
  const rules = runRules(ctx);
  return { setup, prep, ws: w, keyWs: k, keyOn, ctx, rules, verdict: worstVerdict(rules), worstRatio, worstIndex, belowMarginIndex, gap };
}

/** Lowest reserve ratio over cranking..`last` and where (Infinity at 0 if no point has a ratio). */
export function worstReserve(ws: Workspace, last: number): { worstRatio: number; worstIndex: number } {
  let worstRatio = Infinity;
  let worstIndex = 0;
  for (let i = 0; i <= last; i++) {
    const r = ws.reserveRatio[i]!;
    if (r < worstRatio) { worstRatio = r; worstIndex = i; }
  }
  return { worstRatio, worstIndex };
}

/** What the rules read, for a setup swept into `ws` with the gap `gapM`. */
export function ruleContext(s: Session, setup: SetupSpec, prep: PreparedSetup, gapM: number, ws: Workspace, keyOn: KeyOnReport, baseline: Baseline | null, gap: PlugGapSuggestion | null, worstRatio: number, worstIndex: number): RuleContext {
  return {
    engine: s.engine,
    c: s.conditions,
    setup: gapM === setup.plugGapM ? setup : { ...setup, plugGapM: gapM },
    p: prep,
    grid: s.grids.sweep,
    ws,
    redlineIndex: s.grids.redlineIndex,
    idleIndex: s.grids.idleIndex,
    keyOn,
    margin: s.margin,
    baseline,
    gap,
    worstRatio,
    worstIndex,
  };
}

/** What a candidate is compared with: the existing setup's energy across the same rpm grid. */
export function baselineOf(a: Analysis, label?: string): Baseline {
  return baselineFrom(label ?? a.setup.label, a.prep, a.ws, a.worstRatio);
}
