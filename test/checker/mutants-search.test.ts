/**
 * Fast checks of the parts-bin search (search.ts) on small invented bins with a coarse rpm grid,
 * held to a brute-force reference built in this file from the public single-setup check:
 * - search.ts doc contract: "the report of a combination is the one `checkSetup` gives it";
 *   every module x coil x ballast option (none, each ballast without and with a cranking bypass)
 *   is one combination; ranking = no fail first, then worst-rpm reserve ratio (higher first), then
 *   energy at redline (higher first), ties keep bin order; near-duplicates (same module, coil,
 *   tach, leads, plugs and identical ranking figures as one ranked above) dropped from the top N;
 *   shelf tach / leads / plugs tried only where the fails are all in TACH_RULES / LEADS_PLUG_RULES,
 *   today's leads and plugs first if they pass, else the passing pair (leads outer, plugs inner,
 *   today's first) with the best ranking (ties: first), today's tach if it passes else the first
 *   shelf tach that does.
 * - types.ts: SearchInput (shelf, topN default 5, options.skipGapSuggestion), SearchCandidate
 *   (indices, -1 keeps today's part / no ballast), SearchResult (evaluated, withoutFail,
 *   rejectedByRule), and search.ts's onProgress contract (module-and-coil pairs tried, after each).
 * Expected values never come from searchBest. All names are invented.
 */
import { describe, expect, it } from 'vitest';
import {
  checkSetup,
  searchBest,
  type BallastSpec,
  type CoilSpec,
  type LeadsSpec,
  type ModuleSpec,
  type PlugSpec,
  type RuleId,
  type SearchInput,
  type SetupReport,
  type SetupSpec,
  type TachSpec,
} from '../../electron/checker/index.js';
import { LEADS_PLUG_RULES, TACH_RULES } from '../../electron/checker/rules/index.js';
import { ballastCoil, cdModule, coil, fourCylinder, ironBallast, module, pointsSetup } from './fixtures.js';

// ---------------------------------------------------------------------------------------------
// Brute-force reference (search.ts doc contract; same construction as search-equivalence.test.ts).

interface Row {
  moduleIndex: number;
  coilIndex: number;
  ballastIndex: number;
  crankingBypass: boolean;
  tachIndex: number;
  leadsIndex: number;
  plugIndex: number;
  setup: SetupSpec;
  report: SetupReport;
  noFail: boolean;
  worst: number;
  energy: number;
}

/** The label search.ts documents for a candidate (candidateLabel): module with coil[, ballast[ and cranking bypass]][; fit leads][; fit plug][; fit tach]. */
function label(mod: ModuleSpec, c: CoilSpec, b: BallastSpec | null, bypass: boolean, t: TachSpec | null, l: LeadsSpec | null, p: PlugSpec | null): string {
  let s = `${mod.name} with ${c.name}${b ? `, ${b.name}${bypass ? ' and cranking bypass' : ''}` : ''}`;
  if (l) s += `; fit ${l.name}`;
  if (p) s += `; fit ${p.name}`;
  if (t) s += `; fit ${t.name}`;
  return s;
}

function setupOf(input: SearchInput, mi: number, ci: number, bi: number, bypass: boolean, ti = -1, li = -1, pi = -1): SetupSpec {
  const mod = input.modules[mi]!;
  const c = input.coils[ci]!;
  const b = bi >= 0 ? input.ballasts[bi]! : null;
  const t = ti >= 0 ? input.shelf!.tachs[ti]! : null;
  const l = li >= 0 ? input.shelf!.leads[li]! : null;
  const p = pi >= 0 ? input.shelf!.plugs[pi]! : null;
  return {
    label: label(mod, c, b, bypass, t, l, p),
    switching: mod.moduleType,
    coil: c,
    ballast: b,
    crankingBypass: bypass,
    moduleFeed: 'switched-15',
    module: mod,
    condenserF: null,
    tach: t ?? input.tach,
    leads: l ?? input.leads,
    plug: p ?? input.plug,
    plugGapM: input.plugGapM,
    magneto: null,
  };
}

/** Shelf entries other than today's part (field by field), -1 (today's) first. */
function choices<T>(today: T | null, shelf: readonly T[] | undefined): number[] {
  return [-1, ...(shelf ?? []).flatMap((x, i) => (today !== null && JSON.stringify(x) === JSON.stringify(today) ? [] : [i]))];
}

interface Reference {
  rows: Row[];
  ranked: Row[];
  top: Row[];
  withoutFail: number;
  rejected: Map<RuleId, number>;
  baseline: SetupReport;
}

function reference(input: SearchInput): Reference {
  const quick = { ...input.options, skipGapSuggestion: true };
  const baseline = { ...checkSetup(input.engine, input.existing, input.conditions, quick), label: 'the existing setup' };
  const energyOf = (r: SetupReport): number => {
    let last = 0;
    r.points.forEach((p, i) => { if (p.rpm <= input.engine.redlineRpm * (1 + 1e-9)) last = i; });
    return r.points[last]!.storedEnergyJ;
  };
  const check = (setup: SetupSpec): SetupReport => checkSetup(input.engine, setup, input.conditions, quick, baseline);
  const rows: Row[] = [];
  input.modules.forEach((_m, mi) => input.coils.forEach((_c, ci) => {
    const options: Array<[number, boolean]> = [[-1, false]];
    input.ballasts.forEach((_b, bi) => options.push([bi, false], [bi, true]));
    for (const [bi, bypass] of options) {
      let setup = setupOf(input, mi, ci, bi, bypass);
      let report = check(setup);
      let fit = [-1, -1, -1];
      const fails = report.rules.filter((r) => r.verdict === 'fail').map((r) => r.id);
      if (fails.length > 0 && input.shelf && fails.every((id) => TACH_RULES.has(id) || LEADS_PLUG_RULES.has(id))) {
        // Pairs in order (today's first, leads outer, plugs inner); in each, today's tach, then the shelf's in order.
        type Choice = { t: number; l: number; p: number; setup: SetupSpec; report: SetupReport };
        let pick: Choice | null = null;
        let todayPair: Choice | null = null;
        for (const l of choices(input.leads, input.shelf.leads)) {
          for (const p of choices(input.plug, input.shelf.plugs)) {
            for (const t of choices(input.tach, input.shelf.tachs)) {
              if (l < 0 && p < 0 && t < 0) continue;
              const s2 = setupOf(input, mi, ci, bi, bypass, t, l, p);
              const r2 = check(s2);
              if (r2.verdict === 'fail') continue;
              const v = { t, l, p, setup: s2, report: r2 };
              if (l < 0 && p < 0) { todayPair ??= v; break; }
              if (!pick || r2.worstReserveRatio > pick.report.worstReserveRatio || (r2.worstReserveRatio === pick.report.worstReserveRatio && energyOf(r2) > energyOf(pick.report))) pick = v;
              break; // a later tach in the same pair ranks the same (the tach changes no figure): the first wins
            }
          }
        }
        const chosen = todayPair ?? pick;
        if (chosen) { setup = chosen.setup; report = chosen.report; fit = [chosen.t, chosen.l, chosen.p]; }
      }
      rows.push({ moduleIndex: mi, coilIndex: ci, ballastIndex: bi, crankingBypass: bypass, tachIndex: fit[0]!, leadsIndex: fit[1]!, plugIndex: fit[2]!, setup, report, noFail: report.verdict !== 'fail', worst: report.worstReserveRatio, energy: energyOf(report) });
    }
  }));
  const rejected = new Map<RuleId, number>();
  let withoutFail = 0;
  for (const r of rows) {
    if (r.noFail) withoutFail++;
    for (const rule of r.report.rules) if (rule.verdict === 'fail') rejected.set(rule.id, (rejected.get(rule.id) ?? 0) + 1);
  }
  const ranked = [...rows].sort((a, b) => (a.noFail !== b.noFail ? (a.noFail ? -1 : 1) : a.worst !== b.worst ? b.worst - a.worst : b.energy - a.energy));
  const same = (a: Row, b: Row): boolean =>
    a.moduleIndex === b.moduleIndex && a.coilIndex === b.coilIndex && a.tachIndex === b.tachIndex && a.leadsIndex === b.leadsIndex && a.plugIndex === b.plugIndex &&
    a.noFail === b.noFail && a.worst === b.worst && a.energy === b.energy;
  const top: Row[] = [];
  for (const r of ranked) if (!top.some((t) => same(t, r))) top.push(r);
  return { rows, ranked, top, withoutFail, rejected, baseline };
}

const key = (t: { moduleIndex: number; coilIndex: number; ballastIndex: number; crankingBypass: boolean; tachIndex: number; leadsIndex: number; plugIndex: number }): string =>
  `m${t.moduleIndex} c${t.coilIndex} b${t.ballastIndex}${t.crankingBypass ? '+bypass' : ''} t${t.tachIndex} l${t.leadsIndex} p${t.plugIndex}`;

/** Everything the contract fixes, compared against the reference: counts, rejections, the top N in order, each full report. */
function expectMatches(input: SearchInput, ref: Reference = reference(input)): void {
  const got = searchBest(input);
  const topN = input.topN ?? 5;
  // types.ts SearchResult: evaluated = one per module x coil x ballast option; withoutFail; rejectedByRule.
  expect(got.evaluated).toBe(input.modules.length * input.coils.length * (1 + 2 * input.ballasts.length));
  expect(got.evaluated).toBe(ref.rows.length);
  expect(got.withoutFail).toBe(ref.withoutFail);
  expect(new Map(Object.entries(got.rejectedByRule))).toEqual(ref.rejected);
  // search.ts ranking and near-duplicate rule; topN limits the list.
  expect(got.top.map(key)).toEqual(ref.top.slice(0, topN).map(key));
  // search.ts: "the report of a combination is the one checkSetup gives it" (with the caller's options).
  got.top.forEach((t, i) => {
    const r = ref.top[i]!;
    expect(t.report.label).toBe(r.setup.label);
    expect(t.report.verdict).toBe(r.report.verdict);
    expect(t.report.worstReserveRatio).toBe(r.worst);
    expect(t.report).toEqual(checkSetup(input.engine, r.setup, input.conditions, input.options, ref.baseline));
  });
}

// ---------------------------------------------------------------------------------------------
// A small invented bin.

const TODAY_TACH: TachSpec = { name: 'Test dash tach', senses: 'coil-negative-pulses' };
const TODAY_LEADS: LeadsSpec = { name: 'Test copper leads', core: 'copper', resistancePerLeadOhm: 50 };
const TODAY_PLUG: PlugSpec = { name: 'Test plain plug', resistor: false, resistorOhm: 0, gapMinM: 0.5e-3, gapMaxM: 1.1e-3 };

const cdNoTach = cdModule({ name: 'Test CD box A', tachOutput: false });
const suppressedLimiter = module({ name: 'Test limiter B', needsSuppressedLeads: true });
const sixVoltUnit = module({ name: 'Test six-volt C', supplyMinV: 4.5, supplyMaxV: 9 });
const cdTwin = { ...cdNoTach, name: 'Test CD box D' };
const plainLimiter = module({ name: 'Test limiter E' });
const clampedLimiter = module({ name: 'Test clamped limiter F', primaryClampV: 250 });
const lowClamp = module({ name: 'Test low clamp G', primaryClampV: 150 });

const coil3 = coil({ name: 'Test coil 3 ohm' });
const coil3Twin = coil({ name: 'Test coil 3 ohm twin' });
const coil15 = { ...ballastCoil(), name: 'Test ballast coil' };
const iron = ironBallast({ name: 'Test iron wire' });

function bin(over: Partial<SearchInput> = {}): SearchInput {
  return {
    engine: fourCylinder,
    existing: pointsSetup({ label: 'Test existing points' }),
    coils: [coil3, coil3Twin, coil15],
    modules: [cdNoTach, suppressedLimiter, sixVoltUnit, cdTwin, plainLimiter, clampedLimiter, lowClamp],
    ballasts: [iron],
    tach: TODAY_TACH,
    leads: TODAY_LEADS,
    plug: TODAY_PLUG,
    plugGapM: 0.8e-3,
    options: { rpmPoints: 10, skipGapSuggestion: true },
    topN: 5,
    ...over,
  };
}

// ---------------------------------------------------------------------------------------------

describe('searchBest on a small bin without a shelf (search.ts ranking, types.ts counts)', () => {
  const input = bin({ topN: 100 });
  const ref = reference(input);

  it('the bin is worth testing on: passes, fails, ties and near-duplicates', () => {
    expect(ref.withoutFail).toBeGreaterThan(0);
    expect(ref.withoutFail).toBeLessThan(ref.rows.length);
    // Near-duplicates exist (CD fed from terminal 15 ignores its ballast), so dropping them matters.
    expect(ref.top.length).toBeLessThan(ref.ranked.length);
    // Some failing combination has a higher worst ratio than some passing one (no-fail-first matters).
    const minPass = Math.min(...ref.rows.filter((r) => r.noFail).map((r) => r.worst));
    expect(ref.rows.some((r) => !r.noFail && r.worst > minPass)).toBe(true);
  });

  it('ranks every combination as the reference does when topN exceeds the bin', () => expectMatches(input, ref));
  it('topN smaller than the bin keeps the first N (types.ts topN)', () => expectMatches({ ...input, topN: 4 }, ref));
  it('topN 1 and topN 0', () => {
    expectMatches({ ...input, topN: 1 }, ref);
    expect(searchBest({ ...input, topN: 0 }).top).toEqual([]);
  });

  it('identical coils under two names tie and keep bin order (search.ts: ties keep the bin order)', () => {
    const got = searchBest(input);
    const i0 = got.top.findIndex((t) => t.moduleIndex === 4 && t.coilIndex === 0 && t.ballastIndex === -1);
    const i1 = got.top.findIndex((t) => t.moduleIndex === 4 && t.coilIndex === 1 && t.ballastIndex === -1);
    expect(i0).toBeGreaterThanOrEqual(0);
    expect(i1).toBe(i0 + 1);
  });

  it('the ballast bypass changes the worst ratio (cranking) but not the redline energy for the ballast coil', () => {
    const a = ref.rows.find((r) => r.moduleIndex === 4 && r.coilIndex === 2 && r.ballastIndex === 0 && !r.crankingBypass)!;
    const b = ref.rows.find((r) => r.moduleIndex === 4 && r.coilIndex === 2 && r.ballastIndex === 0 && r.crankingBypass)!;
    expect(a.energy).toBe(b.energy);
    expect(a.worst).not.toBe(b.worst);
    const got = searchBest(input).top.map(key);
    expect(got).toContain(key(a));
    expect(got).toContain(key(b));
    // And a clamp-limited unit: the same worst ratio with and without the ballast, different redline energies, both kept.
    const c = ref.rows.find((r) => r.moduleIndex === 6 && r.coilIndex === 0 && r.ballastIndex === -1)!;
    const d = ref.rows.find((r) => r.moduleIndex === 6 && r.coilIndex === 0 && r.ballastIndex === 0 && r.crankingBypass)!;
    expect(c.worst).toBe(d.worst);
    expect(c.energy).not.toBe(d.energy);
    expect(got).toContain(key(c));
    expect(got).toContain(key(d));
  });

  it('same figures, different verdicts are not near-duplicates (search.ts: the same ranking figures includes no-fail)', () => {
    // An unlimited switch clamped low: the worst ratio is clamp-set, the redline energy is the same with or
    // without the cranking bypass, but the bypass lets the cranking current past the switch's rating.
    const clampedSwitch = module({ name: 'Test clamped switch', moduleType: 'transistor-points', currentLimitA: null, maxDutyFraction: null, primaryClampV: 175, maxCurrentA: 5, minCoilResistanceOhm: 0 });
    const lowCoil = { ...coil15, name: 'Test 1.2 ohm ballast coil', primaryResistanceOhm20C: { value: 1.2, provenance: 'catalogue' as const } };
    const small = bin({ modules: [clampedSwitch], coils: [lowCoil], topN: 10 });
    const ref = reference(small);
    const [, plain, bypassed] = ref.rows;
    expect([plain!.worst, plain!.energy, plain!.noFail]).toEqual([bypassed!.worst, bypassed!.energy, !bypassed!.noFail]);
    expectMatches(small, ref);
    expect(searchBest(small).top).toHaveLength(3);
  });

  it('reports onProgress after each module-and-coil pair (search.ts onProgress)', () => {
    const calls: Array<[number, number]> = [];
    const small = bin({ modules: [plainLimiter, cdNoTach], coils: [coil3, coil15, coil3Twin], topN: 1 });
    searchBest(small, (done, total) => calls.push([done, total]));
    expect(calls).toEqual([1, 2, 3, 4, 5, 6].map((d) => [d, 6]));
  });

  it('empty bins give no combination (types.ts SearchResult)', () => {
    for (const over of [{ coils: [] }, { modules: [] }]) {
      const got = searchBest(bin(over));
      expect(got.evaluated).toBe(0);
      expect(got.withoutFail).toBe(0);
      expect(got.top).toEqual([]);
      expect(got.rejectedByRule).toEqual({});
    }
    // No ballasts: one option per module and coil.
    expectMatches(bin({ ballasts: [], modules: [plainLimiter, cdNoTach], topN: 10 }));
  });

  it('skipGapSuggestion off gives the full reports checkSetup gives with the same options (types.ts CheckOptions)', () => {
    expectMatches(bin({ modules: [plainLimiter, cdNoTach], coils: [coil3, coil15], topN: 3, options: { rpmPoints: 10 } }));
    expectMatches(bin({ modules: [plainLimiter], coils: [coil15], topN: 2, options: { rpmPoints: 10, skipGapSuggestion: false } }));
  });
});

describe('the shelf (search.ts: tach, leads and plugs fitted only where they change a verdict, in the documented order)', () => {
  const cable: TachSpec = { name: 'Test cable tach', senses: 'cable' };
  const outputTach: TachSpec = { name: 'Test output tach', senses: 'module-output' };
  const carbonLeads: LeadsSpec = { name: 'Test carbon leads', core: 'carbon', resistancePerLeadOhm: 5000 };
  const spiralLeads: LeadsSpec = { name: 'Test spiral leads', core: 'spiral', resistancePerLeadOhm: 500 };
  const resistorPlug: PlugSpec = { name: 'Test resistor plug', resistor: true, resistorOhm: 5000, gapMinM: 0.5e-3, gapMaxM: 1.1e-3 };
  const small = (shelf: SearchInput['shelf'], over: Partial<SearchInput> = {}): SearchInput =>
    bin({ modules: [cdNoTach, suppressedLimiter, sixVoltUnit, plainLimiter], coils: [coil3, coil15], shelf, topN: 30, ...over });

  it('a full shelf: first passing tach, best leads/plug pair, uncurable fails kept', () => {
    const shelf = {
      tachs: [outputTach, { ...TODAY_TACH }, cable, { name: 'Test cable tach two', senses: 'cable' as const }],
      leads: [{ ...TODAY_LEADS }, carbonLeads, spiralLeads],
      plugs: [{ ...TODAY_PLUG, gapMaxM: 1.2e-3 }, resistorPlug],
    };
    const input = small(shelf);
    const ref = reference(input);
    // The shelf cures something of each kind here.
    expect(ref.rows.some((r) => r.tachIndex === 2)).toBe(true);
    expect(ref.rows.some((r) => r.leadsIndex >= 0 || r.plugIndex >= 0)).toBe(true);
    expectMatches(input, ref);
  });

  it("shelf parts that share today's name but differ in one field are alternatives (index 0 fitted)", () => {
    const shelves = [
      { tachs: [{ ...TODAY_TACH, senses: 'cable' as const }], leads: [], plugs: [] },
      { tachs: [], leads: [{ ...TODAY_LEADS, core: 'carbon' as const }], plugs: [] },
      { tachs: [], leads: [{ ...TODAY_LEADS, resistancePerLeadOhm: 5000 }], plugs: [] },
      { tachs: [], leads: [], plugs: [{ ...TODAY_PLUG, resistor: true }] },
      { tachs: [{ ...TODAY_TACH, senses: 'cable' as const }], leads: [{ ...TODAY_LEADS, core: 'spiral' as const }], plugs: [{ ...TODAY_PLUG, resistor: true, resistorOhm: 5000 }] },
    ];
    for (const shelf of shelves) {
      const input = small(shelf, { modules: [cdNoTach, suppressedLimiter], coils: [coil3], ballasts: [] });
      const ref = reference(input);
      expect(ref.withoutFail).toBeGreaterThan(0);
      expectMatches(input, ref);
    }
  });

  it('ties between passing pairs go to the first in order (leads before plugs, shelf order)', () => {
    const twinLeads = { ...carbonLeads, name: 'Test carbon leads twin' };
    const input = small({ tachs: [], leads: [carbonLeads, twinLeads], plugs: [resistorPlug, { ...resistorPlug, name: 'Test resistor plug twin' }] }, { modules: [suppressedLimiter], coils: [coil3, coil15] });
    expectMatches(input);
  });

  it('a tach-only fail is cured by a tach without touching leads and plugs, and a pair-only fail without touching the tach', () => {
    const input = small({ tachs: [cable], leads: [carbonLeads], plugs: [resistorPlug] }, { modules: [cdNoTach, suppressedLimiter], coils: [coil3], ballasts: [] });
    const ref = reference(input);
    expect(ref.rows.map(key)).toEqual(['m0 c0 b-1 t0 l-1 p-1', expect.stringMatching(/^m1 c0 b-1 t-1 l0 p-1$|^m1 c0 b-1 t-1 l-1 p0$/)]);
    expectMatches(input, ref);
  });

  it("today's parts missing (null) with a shelf present: nothing to cure, no crash (types.ts: tach, leads, plug may be null)", () => {
    const input = small({ tachs: [cable], leads: [carbonLeads], plugs: [resistorPlug] }, { tach: null, leads: null, plug: null, modules: [cdNoTach, suppressedLimiter], coils: [coil3], ballasts: [] });
    expectMatches(input);
  });

  it('an empty shelf changes nothing', () => {
    const input = small({ tachs: [], leads: [], plugs: [] }, { modules: [cdNoTach, suppressedLimiter], coils: [coil3] });
    expectMatches(input);
  });
});
