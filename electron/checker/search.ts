/**
 * The best combination from a parts bin: every module x coil x ballast option (none, or each
 * ballast on the shelf with and without a cranking bypass) on one engine. Each combination is
 * swept into one reused workspace and judged by the rules' fail tests alone (judge.ts); only the
 * top N are analysed again for full reports, so the report of a combination is the one
 * `checkSetup` gives it.
 *
 * The shelf's tachometers, leads and plugs (`SearchInput.shelf`) are tried only where they change
 * a verdict: a combination that fails with today's tach, leads and plugs, and fails only rules
 * those parts can change (`TACH_RULES`, `LEADS_PLUG_RULES`), gets
 * - today's leads and plugs if they pass those rules, else the pair (leads, plugs; today's first,
 *   then the shelf's in order, leads before plugs) that passes everything with the best ranking
 *   (ties: the first in that order);
 * - today's tach if it passes, else the first shelf tach that does.
 * If no such choice passes every rule, the combination keeps today's parts and its fails. Each
 * module x coil x ballast option is one combination either way.
 *
 * Ranking: combinations without a fail first, then the worst-rpm reserve ratio (higher first),
 * then the energy at redline (higher first); ties keep the bin order. Near-duplicates are dropped
 * from the top N: a combination with the same module, coil, tach, leads and plugs as one ranked
 * above it and exactly the same ranking figures differs only in a ballast (or bypass) that changes
 * nothing (a ballast in front of a CD unit fed from terminal 15, for instance).
 */
import { judge, type Judgement } from './judge.js';
import { keyOnReport } from './keyon.js';
import { withCrankingBypass } from './cranking.js';
import { prepareSetup, type PreparedSetup } from './prepare.js';
import { toReport } from './report.js';
import { FAIL_TESTS, LEADS_PLUG_RULES, TACH_RULES } from './rules/index.js';
import type { RuleContext } from './rules/context.js';
import { analyse, baselineOf, createSession, type Session } from './session.js';
import { createWorkspace, type Workspace } from './sweep.js';
import type { BallastSpec, CoilSpec, LeadsSpec, ModuleSpec, PlugSpec, RuleId, SearchCandidate, SearchInput, SearchResult, SetupSpec, TachSpec } from './types.js';
import type { Baseline } from './rules/context.js';

interface Scored {
  coil: number;
  module: number;
  ballast: number;
  bypass: boolean;
  tach: number;
  leads: number;
  plug: number;
  noFail: boolean;
  worst: number;
  energyAtRedline: number;
}

/** Accessories fitted to a candidate: -1 keeps today's, else an index into the shelf's list. */
interface Fitted {
  tach: number;
  leads: number;
  plug: number;
}
const AS_TODAY: Fitted = { tach: -1, leads: -1, plug: -1 };

function tachOf(input: SearchInput, i: number): TachSpec | null {
  return i < 0 ? input.tach : input.shelf!.tachs[i]!;
}
function leadsOf(input: SearchInput, i: number): LeadsSpec | null {
  return i < 0 ? input.leads : input.shelf!.leads[i]!;
}
function plugOf(input: SearchInput, i: number): PlugSpec | null {
  return i < 0 ? input.plug : input.shelf!.plugs[i]!;
}

/** The label says which of today's tach, leads and plugs the candidate replaces. */
export function candidateLabel(mod: ModuleSpec, coil: CoilSpec, ballast: BallastSpec | null, bypass: boolean, extras: { tach: TachSpec | null; leads: LeadsSpec | null; plug: PlugSpec | null } | null): string {
  let label = `${mod.name} with ${coil.name}${ballast ? `, ${ballast.name}${bypass ? ' and cranking bypass' : ''}` : ''}`;
  if (extras?.leads) label += `; fit ${extras.leads.name}`;
  if (extras?.plug) label += `; fit ${extras.plug.name}`;
  if (extras?.tach) label += `; fit ${extras.tach.name}`;
  return label;
}

function candidateSetup(input: SearchInput, coil: CoilSpec, mod: ModuleSpec, ballast: BallastSpec | null, bypass: boolean, named = true, fit: Fitted = AS_TODAY): SetupSpec {
  const changed = fit.tach >= 0 || fit.leads >= 0 || fit.plug >= 0;
  return {
    label: named
      ? candidateLabel(mod, coil, ballast, bypass, changed ? { tach: fit.tach >= 0 ? tachOf(input, fit.tach) : null, leads: fit.leads >= 0 ? leadsOf(input, fit.leads) : null, plug: fit.plug >= 0 ? plugOf(input, fit.plug) : null } : null)
      : 'candidate',
    switching: mod.moduleType,
    coil,
    ballast,
    crankingBypass: bypass,
    moduleFeed: 'switched-15',
    module: mod,
    condenserF: null,
    tach: tachOf(input, fit.tach),
    leads: leadsOf(input, fit.leads),
    plug: plugOf(input, fit.plug),
    plugGapM: input.plugGapM,
    magneto: null,
  };
}

function better(a: Scored, b: Scored): number {
  if (a.noFail !== b.noFail) return a.noFail ? -1 : 1;
  if (a.worst !== b.worst) return b.worst - a.worst;
  return b.energyAtRedline - a.energyAtRedline;
}

const sameTach = (a: TachSpec | null, b: TachSpec): boolean => a !== null && a.name === b.name && a.senses === b.senses;
const sameLeads = (a: LeadsSpec | null, b: LeadsSpec): boolean => a !== null && a.name === b.name && a.core === b.core && a.resistancePerLeadOhm === b.resistancePerLeadOhm;
const samePlug = (a: PlugSpec | null, b: PlugSpec): boolean =>
  a !== null && a.name === b.name && a.resistor === b.resistor && a.resistorOhm === b.resistorOhm && a.gapMinM === b.gapMinM && a.gapMaxM === b.gapMaxM;

/** The shelf's alternatives to today's parts, in shelf order (-1, today's, first; shelf copies of today's left out). */
interface Alternatives {
  tachs: number[];
  pairs: Array<[leads: number, plug: number]>;
}

function alternativesOf(input: SearchInput): Alternatives | null {
  const shelf = input.shelf;
  if (!shelf) return null;
  const tachs = shelf.tachs.flatMap((t, i) => (sameTach(input.tach, t) ? [] : [i]));
  const leads = [-1, ...shelf.leads.flatMap((l, i) => (sameLeads(input.leads, l) ? [] : [i]))];
  const plugs = [-1, ...shelf.plugs.flatMap((p, i) => (samePlug(input.plug, p) ? [] : [i]))];
  const pairs: Array<[number, number]> = [];
  for (const l of leads) for (const p of plugs) if (l >= 0 || p >= 0) pairs.push([l, p]);
  if (tachs.length === 0 && pairs.length === 0) return null;
  return { tachs, pairs };
}

/** What a failing combination needs from the shelf: null when something no accessory changes fails. */
function needs(failed: Uint8Array): { tach: boolean; pair: boolean } | null {
  let tach = false;
  let pair = false;
  for (let k = 0; k < failed.length; k++) {
    if (failed[k] !== 1) continue;
    const id: RuleId = FAIL_TESTS[k]![0];
    if (TACH_RULES.has(id)) tach = true;
    else if (LEADS_PLUG_RULES.has(id)) pair = true;
    else return null;
  }
  return { tach, pair };
}

const TACH_TEST = FAIL_TESTS.find(([id]) => id === 'tach')![1];

interface Remedy {
  fit: Fitted;
  worst: number;
  energyAtRedline: number;
}

/**
 * `onProgress` (optional) is told how many of the module-and-coil pairs have been tried, after each
 * pair; it changes nothing in the answer.
 */
export function searchBest(input: SearchInput, onProgress?: (done: number, total: number) => void): SearchResult {
  const s = createSession(input.engine, input.conditions, input.options);
  const ex = analyse(s, input.existing, null, false);
  const base = baselineOf(ex, 'the existing setup');
  const ws = createWorkspace(s.grids.sweep.n);
  const redline = s.grids.redlineIndex;
  const failed = new Uint8Array(FAIL_TESTS.length);
  const alternatives = alternativesOf(input);
  // Shelf variants are swept apart from `ws`, which a cranking-bypass twin still needs.
  const variantWs = alternatives ? createWorkspace(s.grids.sweep.n) : null;
  const variantFailed = new Uint8Array(FAIL_TESTS.length);
  const scored: Scored[] = [];
  const rejected: Partial<Record<RuleId, number>> = {};
  let withoutFail = 0;
  const record = (coil: number, mod: number, ballast: number, bypass: boolean, j: Judgement): void => {
    const remedy = j.fails && alternatives ? remedyFor(s, input, alternatives, j.ctx, base, variantWs!, variantFailed, failed, redline) : null;
    if (remedy) {
      withoutFail++;
      scored.push({ coil, module: mod, ballast, bypass, ...remedy.fit, noFail: true, worst: remedy.worst, energyAtRedline: remedy.energyAtRedline });
      return;
    }
    if (j.fails) {
      for (let k = 0; k < failed.length; k++) {
        if (failed[k] === 1) {
          const id = FAIL_TESTS[k]![0];
          rejected[id] = (rejected[id] ?? 0) + 1;
        }
      }
    } else {
      withoutFail++;
    }
    scored.push({ coil, module: mod, ballast, bypass, tach: -1, leads: -1, plug: -1, noFail: !j.fails, worst: j.worstRatio, energyAtRedline: ws.energyJ[redline]! });
  };
  const prepare = (setup: SetupSpec): PreparedSetup => prepareSetup(s.engine, setup, s.conditions, s.model);
  // Bin order (module, coil, then no ballast, then each ballast without and with a cranking
  // bypass); the sort below is stable, so ties keep this order.
  for (let mi = 0; mi < input.modules.length; mi++) {
    const mod = input.modules[mi]!;
    for (let ci = 0; ci < input.coils.length; ci++) {
      const coil = input.coils[ci]!;
      const bare = prepare(candidateSetup(input, coil, mod, null, false, false));
      record(ci, mi, -1, false, judge(s, bare, keyOnReport(bare, s.conditions), base, ws, failed));
      for (let bi = 0; bi < input.ballasts.length; bi++) {
        const ballast = input.ballasts[bi]!;
        const plain = prepare(candidateSetup(input, coil, mod, ballast, false, false));
        // The bypass twin runs exactly as `plain` does (the bypass is open once the starter stops,
        // and the ballast heats while running), and key-on is with the starter still: only the
        // cranking path differs, so only it and the cranking points are worked out again.
        const twin = withCrankingBypass(plain, candidateSetup(input, coil, mod, ballast, true, false), s.conditions);
        const keyOn = keyOnReport(plain, s.conditions);
        record(ci, mi, bi, false, judge(s, plain, keyOn, base, ws, failed));
        record(ci, mi, bi, true, judge(s, twin, keyOn, base, ws, failed, { crankingOnly: true }));
      }
      onProgress?.(mi * input.coils.length + ci + 1, input.modules.length * input.coils.length);
    }
  }
  scored.sort(better);
  const topN = Math.max(0, Math.floor(input.topN ?? 5));
  const withGap = !(input.options?.skipGapSuggestion ?? false);
  const kept: Scored[] = [];
  for (const sc of scored) {
    if (kept.length >= topN) break;
    if (kept.some((k) => nearDuplicate(k, sc))) continue;
    kept.push(sc);
  }
  const top: SearchCandidate[] = kept.map((sc) => {
    const setup = candidateSetup(input, input.coils[sc.coil]!, input.modules[sc.module]!, sc.ballast >= 0 ? input.ballasts[sc.ballast]! : null, sc.bypass, true, sc);
    return {
      coilIndex: sc.coil,
      moduleIndex: sc.module,
      ballastIndex: sc.ballast,
      crankingBypass: sc.bypass,
      tachIndex: sc.tach,
      leadsIndex: sc.leads,
      plugIndex: sc.plug,
      report: toReport(s, analyse(s, setup, base, withGap)),
    };
  });
  return { evaluated: scored.length, withoutFail, top, rejectedByRule: rejected };
}

/** Same module, coil and accessories, and the same ranking figures exactly: only a ballast that changes nothing differs. */
function nearDuplicate(a: Scored, b: Scored): boolean {
  return a.module === b.module && a.coil === b.coil && a.tach === b.tach && a.leads === b.leads && a.plug === b.plug && a.noFail === b.noFail && a.worst === b.worst && a.energyAtRedline === b.energyAtRedline;
}

/**
 * The shelf's cure for a combination that failed (its judgement's context `ctx`, its failed rules in
 * `failed`), or null if there is none (see the header for which one is picked).
 */
function remedyFor(s: Session, input: SearchInput, alt: Alternatives, ctx: RuleContext, base: Baseline, ws: Workspace, variantFailed: Uint8Array, failed: Uint8Array, redline: number): Remedy | null {
  const need = needs(failed);
  if (need === null) return null;
  let tach = -1;
  if (need.tach) {
    tach = -2;
    for (const t of alt.tachs) {
      if (!TACH_TEST({ ...ctx, setup: { ...ctx.setup, tach: input.shelf!.tachs[t]! } })) { tach = t; break; }
    }
    if (tach === -2) return null;
  }
  if (!need.pair) return { fit: { tach, leads: -1, plug: -1 }, worst: ctx.worstRatio, energyAtRedline: ctx.ws.energyJ[redline]! };
  const setup = ctx.p.spec;
  let best: Remedy | null = null;
  for (const [leads, plug] of alt.pairs) {
    const variant: SetupSpec = { ...setup, tach: tachOf(input, tach), leads: leadsOf(input, leads), plug: plugOf(input, plug) };
    const prep = prepareSetup(s.engine, variant, s.conditions, s.model);
    const j = judge(s, prep, keyOnReport(prep, s.conditions), base, ws, variantFailed);
    if (j.fails) continue;
    const energy = ws.energyJ[redline]!;
    if (best === null || j.worstRatio > best.worst || (j.worstRatio === best.worst && energy > best.energyAtRedline)) {
      best = { fit: { tach, leads, plug }, worst: j.worstRatio, energyAtRedline: energy };
    }
  }
  return best;
}
