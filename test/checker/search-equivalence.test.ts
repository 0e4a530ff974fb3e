/**
 * The parts-bin search takes short cuts (rules' fail tests instead of full rule results, the
 * cranking-bypass twin re-swept at its cranking point only, values carried between sweep points
 * when their inputs repeat). These tests hold each short cut to the straightforward path:
 * - the search's ranking, top-N reports, counts and rejections against `checkSetup` run on every
 *   combination and ranked by the documented order (no fail first, then the worst-rpm reserve
 *   ratio, then the energy at redline, ties in bin order);
 * - every rule's fail test against the rule's own verdict;
 * - the bypass twin against preparing and sweeping that setup from scratch;
 * - the sweep's columns against the per-point laws evaluated one point at a time;
 * - the plug-gap bisection's early stop against the full scan, and the comparison's shared
 *   workspace against checking each setup alone.
 * The bins are invented (generated-bin.ts) and exercise most rules both ways.
 */
import { describe, expect, it } from 'vitest';
import {
  chargeCurrentA,
  finalCurrentA,
  ironBallastResistanceOhm,
  meanSquareCurrentA2,
  checkSetup,
  compareSetups,
  searchBest,
  type BallastSpec,
  type CoilSpec,
  type EngineSpec,
  type ModuleSpec,
  type RuleId,
  type SearchInput,
  type SetupReport,
  type SetupSpec,
  type TachSpec,
  type LeadsSpec,
  type PlugSpec,
} from '../../electron/checker/index.js';
import { cdFouledFraction, fouledChargeTauS, fouledFluxCurrentA, fouledTimeToLimitS, reflectedShuntOhm } from '../../electron/checker/fouled.js';
import { gapMeetsMargin, worstRatioForGap } from '../../electron/checker/gap.js';
import { withCrankingBypass } from '../../electron/checker/cranking.js';
import { candidateLabel } from '../../electron/checker/search.js';
import { prepareSetup } from '../../electron/checker/prepare.js';
import { FAIL_TESTS, RULES } from '../../electron/checker/rules/index.js';
import { OFF_TIME_FAIL_RATIO } from '../../electron/checker/rules/spark.js';
import { inductiveSparkDurationS } from '../../electron/checker/secondary.js';
import { analyse, baselineOf, createSession } from '../../electron/checker/session.js';
import { createWorkspace, evaluateGrid, type Workspace } from '../../electron/checker/sweep.js';
import { dwellTimeS, DwellMode } from '../../electron/checker/timing.js';
import { generatedSearch } from './generated-bin.js';
import { cdModule, coil, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

// ---------------------------------------------------------------------------------------------
// The straightforward path.

interface Combination {
  coilIndex: number;
  moduleIndex: number;
  ballastIndex: number;
  crankingBypass: boolean;
  setup: SetupSpec;
}

/** Every combination in bin order: module, coil, then no ballast, then each ballast without and with a bypass. */
function combinations(input: SearchInput): Combination[] {
  const out: Combination[] = [];
  input.modules.forEach((mod: ModuleSpec, moduleIndex) => {
    input.coils.forEach((c: CoilSpec, coilIndex) => {
      const options: Array<[number, boolean]> = [[-1, false]];
      input.ballasts.forEach((_b: BallastSpec, b) => options.push([b, false], [b, true]));
      for (const [ballastIndex, crankingBypass] of options) {
        const ballast = ballastIndex >= 0 ? input.ballasts[ballastIndex]! : null;
        out.push({
          coilIndex,
          moduleIndex,
          ballastIndex,
          crankingBypass,
          setup: {
            label: `${mod.name} with ${c.name}${ballast ? `, ${ballast.name}${crankingBypass ? ' and cranking bypass' : ''}` : ''}`,
            switching: mod.moduleType,
            coil: c,
            ballast,
            crankingBypass,
            moduleFeed: 'switched-15',
            module: mod,
            condenserF: null,
            tach: input.tach,
            leads: input.leads,
            plug: input.plug,
            plugGapM: input.plugGapM,
            magneto: null,
          },
        });
      }
    });
  });
  return out;
}

/** Index of the last sweep point at or below redline: where the search reads "energy at redline". */
function redlineIndex(r: SetupReport, engine: EngineSpec): number {
  let last = 0;
  r.points.forEach((p, i) => { if (p.rpm <= engine.redlineRpm * (1 + 1e-9)) last = i; });
  return last;
}

interface Ranked extends Combination {
  report: SetupReport;
  noFail: boolean;
  worst: number;
  energyAtRedline: number;
  /** -1 keeps today's tach, leads, plugs; else the index on the shelf. */
  tachIndex: number;
  leadsIndex: number;
  plugIndex: number;
}

interface Reference {
  ranked: Ranked[];
  /** `ranked` less the near-duplicates (same module, coil and accessories, identical ranking figures as one above). */
  top: Ranked[];
  rejected: Array<[RuleId, number]>;
  withoutFail: number;
  baseline: SetupReport;
}

/** Shelf entries that are not today's part (compared field by field), by shelf index; -1 (today's) first. */
function shelfChoices<T>(today: T | null, shelf: readonly T[] | undefined): number[] {
  return [-1, ...(shelf ?? []).flatMap((x, i) => (today !== null && JSON.stringify(x) === JSON.stringify(today) ? [] : [i]))];
}

/**
 * Every way to fit the shelf's tach, leads and plugs to a combination, in the documented order:
 * pairs of (leads, plugs) with today's first, leads before plugs; within a pair, today's tach first.
 */
function shelfVariants(input: SearchInput, comb: Combination): Array<{ tach: number; leads: number; plug: number; setup: SetupSpec }> {
  const shelf = input.shelf;
  const out: Array<{ tach: number; leads: number; plug: number; setup: SetupSpec }> = [];
  for (const leads of shelfChoices<LeadsSpec>(input.leads, shelf?.leads)) {
    for (const plug of shelfChoices<PlugSpec>(input.plug, shelf?.plugs)) {
      for (const tach of shelfChoices<TachSpec>(input.tach, shelf?.tachs)) {
        const t = tach >= 0 ? shelf!.tachs[tach]! : null;
        const l = leads >= 0 ? shelf!.leads[leads]! : null;
        const p = plug >= 0 ? shelf!.plugs[plug]! : null;
        const mod = input.modules[comb.moduleIndex]!;
        const ballast = comb.ballastIndex >= 0 ? input.ballasts[comb.ballastIndex]! : null;
        const changed = t !== null || l !== null || p !== null;
        out.push({
          tach,
          leads,
          plug,
          setup: {
            ...comb.setup,
            label: candidateLabel(mod, input.coils[comb.coilIndex]!, ballast, comb.crankingBypass, changed ? { tach: t, leads: l, plug: p } : null),
            tach: t ?? input.tach,
            leads: l ?? input.leads,
            plug: p ?? input.plug,
          },
        });
      }
    }
  }
  return out;
}

function reference(input: SearchInput): Reference {
  const quick = { ...input.options, skipGapSuggestion: true };
  // The search compares each candidate's energy with the existing setup under this label.
  const baseline = { ...checkSetup(input.engine, input.existing, input.conditions, quick), label: 'the existing setup' };
  const rejected = new Map<RuleId, number>();
  let withoutFail = 0;
  const energyOf = (r: SetupReport): number => r.points[redlineIndex(r, input.engine)]!.storedEnergyJ;
  const rows = combinations(input).map((comb): Ranked => {
    let chosen = { comb, tach: -1, leads: -1, plug: -1, report: checkSetup(input.engine, comb.setup, input.conditions, quick, baseline) };
    if (chosen.report.verdict === 'fail' && input.shelf) {
      // Try every variant; keep today's leads and plugs if any variant with them passes (the first
      // such tach), else the best-ranked passing variant (ties: the first in order).
      const passing = shelfVariants(input, comb)
        .slice(1)
        .map((v) => ({ ...v, report: checkSetup(input.engine, v.setup, input.conditions, quick, baseline) }))
        .filter((v) => v.report.verdict !== 'fail');
      const sameLeadsAndPlugs = passing.find((v) => v.leads === -1 && v.plug === -1);
      let pick = sameLeadsAndPlugs;
      if (!pick) {
        for (const v of passing) {
          if (!pick || v.report.worstReserveRatio > pick.report.worstReserveRatio || (v.report.worstReserveRatio === pick.report.worstReserveRatio && energyOf(v.report) > energyOf(pick.report))) pick = v;
        }
      }
      if (pick) chosen = { comb: { ...comb, setup: pick.setup }, tach: pick.tach, leads: pick.leads, plug: pick.plug, report: pick.report };
    }
    const report = chosen.report;
    for (const r of report.rules) if (r.verdict === 'fail') rejected.set(r.id, (rejected.get(r.id) ?? 0) + 1);
    const noFail = report.verdict !== 'fail';
    if (noFail) withoutFail++;
    return { ...chosen.comb, report, noFail, worst: report.worstReserveRatio, energyAtRedline: energyOf(report), tachIndex: chosen.tach, leadsIndex: chosen.leads, plugIndex: chosen.plug };
  });
  // Array.prototype.sort is stable: ties keep bin order.
  const ranked = [...rows].sort((a, b) => {
    if (a.noFail !== b.noFail) return a.noFail ? -1 : 1;
    if (a.worst !== b.worst) return b.worst - a.worst;
    return b.energyAtRedline - a.energyAtRedline;
  });
  const same = (a: Ranked, b: Ranked): boolean =>
    a.moduleIndex === b.moduleIndex && a.coilIndex === b.coilIndex && a.tachIndex === b.tachIndex && a.leadsIndex === b.leadsIndex && a.plugIndex === b.plugIndex &&
    a.noFail === b.noFail && a.worst === b.worst && a.energyAtRedline === b.energyAtRedline;
  const top: Ranked[] = [];
  for (const r of ranked) if (!top.some((t) => same(t, r))) top.push(r);
  return { ranked, top, rejected: [...rejected], withoutFail, baseline };
}

/** The key a search candidate and a reference row are compared by. */
const keyOfTop = (t: { moduleIndex: number; coilIndex: number; ballastIndex: number; crankingBypass: boolean; tachIndex: number; leadsIndex: number; plugIndex: number }): unknown[] =>
  [t.moduleIndex, t.coilIndex, t.ballastIndex, t.crankingBypass, t.tachIndex, t.leadsIndex, t.plugIndex];

const sixVoltPositive: EngineSpec = { ...fourCylinder, name: 'Test six-volt', systemVoltageV: 6, earthPolarity: 'positive', redlineRpm: 5200, pointsFloatRpm: 5000 };

/** Tachs, leads and plugs on the shelf besides the bin's fitted ones (copper leads, a plain plug, a coil-negative tach). */
const SHELF = {
  tachs: [{ name: 'Dash tachometer', senses: 'coil-negative-pulses' as const }, { name: 'Cable tachometer', senses: 'cable' as const }, { name: 'Tach for a module output', senses: 'module-output' as const }],
  leads: [{ name: 'Carbon leads', core: 'carbon' as const, resistancePerLeadOhm: 12000 }, { name: 'Spiral leads', core: 'spiral' as const, resistancePerLeadOhm: 500 }],
  plugs: [{ name: 'Resistor plug', resistor: true, resistorOhm: 5000, gapMinM: 0.6e-3, gapMaxM: 1.1e-3 }],
};

const cases: Array<[string, SearchInput]> = [
  ['a 12 V negative-earth four, default conditions', generatedSearch({ coils: 12, modules: 8, ballasts: 2, seed: 7, rpmPoints: 60, topN: 8 })],
  ['a 6 V positive-earth four on a cold morning, Paschen breakdown', sixVoltBin()],
  ['a 12 V four with tachs, leads and plugs on the shelf', { ...generatedSearch({ coils: 8, modules: 8, ballasts: 1, seed: 19, rpmPoints: 40, topN: 12 }), shelf: SHELF }],
];

/** The generated bin made over for a 6 V positive-earth car: most modules run on 6 V and either earth. */
function sixVoltBin(): SearchInput {
  const base = generatedSearch({ coils: 10, modules: 8, ballasts: 2, seed: 11, rpmPoints: 40, topN: 6 });
  return {
    ...base,
    engine: sixVoltPositive,
    coils: base.coils.map((c, i) => (i % 2 === 0 ? { ...c, ratedVoltageV: 6 } : c)),
    modules: base.modules.map((m, i) => (i === 0 ? { ...m, supplyMinV: 8 } : { ...m, supplyMinV: m.supplyMinV / 2.5, earthPolarities: i % 3 === 2 ? ['negative'] : ['negative', 'positive'] })),
    conditions: { ambientC: { value: -10, provenance: 'engine override' } },
    options: { rpmPoints: 40, breakdownModel: 'paschen' },
  };
}

describe('parts-bin search against checking every combination in full', () => {
  for (const [name, input] of cases) {
    it(`ranks, reports and counts identically: ${name}`, () => {
      const ref = reference(input);
      const got = searchBest(input);
      expect(got.evaluated).toBe(ref.ranked.length);
      expect(got.withoutFail).toBe(ref.withoutFail);
      // Same counts, and the same key order (first failing combination in bin order, rules in report order).
      expect(Object.entries(got.rejectedByRule)).toEqual(ref.rejected);
      const topN = input.topN ?? 5;
      expect(got.top.map(keyOfTop)).toEqual(ref.top.slice(0, topN).map(keyOfTop));
      for (let i = 0; i < topN; i++) {
        const r = ref.top[i]!;
        expect(got.top[i]!.report).toEqual(checkSetup(input.engine, r.setup, input.conditions, input.options, ref.baseline));
      }
      // The bin is worth testing on: some pass, most rules reject something, and some
      // combinations tie exactly, so the tie order is exercised.
      expect(ref.withoutFail).toBeGreaterThan(0);
      expect(ref.withoutFail).toBeLessThan(ref.ranked.length);
      expect(ref.rejected.length).toBeGreaterThanOrEqual(6);
      const key = (r: Reference['ranked'][number]): string => `${r.noFail}|${r.worst}|${r.energyAtRedline}`;
      expect(new Set(ref.ranked.map(key)).size).toBeLessThan(ref.ranked.length);
    });
  }

  it('orders by the exact worst ratio, however close two combinations come', () => {
    // Both coils are clamp-limited (n x 150 V) even while cranking, so the worst ratio is in proportion to n and the
    // energy is the same: the second coil's ratio is higher by a part in 10^12 and must rank first.
    const c1 = coil({ name: 'n 100', turnsRatio: 100 });
    const c2 = coil({ name: 'n 100 and a hair', turnsRatio: 100 * (1 + 1e-12) });
    const input: SearchInput = { ...generatedSearch({ coils: 0, modules: 0, ballasts: 0, seed: 1, rpmPoints: 50 }), coils: [c1, c2], modules: [module({ primaryClampV: 150 })], topN: 2 };
    const ref = reference(input);
    expect(ref.ranked[0]!.worst).toBeGreaterThan(ref.ranked[1]!.worst);
    expect(ref.ranked[0]!.energyAtRedline).toBe(ref.ranked[1]!.energyAtRedline);
    expect(searchBest(input).top.map((t) => t.coilIndex)).toEqual([1, 0]);
  });

  it('gives the whole ranking in the documented order when asked for every combination', () => {
    const input = { ...generatedSearch({ coils: 6, modules: 8, ballasts: 1, seed: 3, rpmPoints: 30 }), options: { rpmPoints: 30, skipGapSuggestion: true } };
    const ref = reference(input);
    const got = searchBest({ ...input, topN: ref.ranked.length });
    expect(got.top.map(keyOfTop)).toEqual(ref.top.map(keyOfTop));
    got.top.forEach((t, i) => expect(t.report.verdict).toBe(ref.top[i]!.report.verdict));
    // CD units fed from terminal 15 ignore a ballast: their ballast variants are dropped as near-duplicates.
    expect(ref.top.length).toBeLessThan(ref.ranked.length);
  });

  it('fits the shelf\'s leads, plugs and tach only where they turn a fail into no fail, and never multiplies the bin', () => {
    const plain = generatedSearch({ coils: 8, modules: 8, ballasts: 1, seed: 19, rpmPoints: 40, topN: 40 });
    const without = searchBest(plain);
    const withShelf = searchBest({ ...plain, shelf: SHELF });
    expect(withShelf.evaluated).toBe(without.evaluated);
    // Copper leads on modules that want suppression, and coil-negative tachs on CD units without a tach output, are cured from the shelf.
    expect(withShelf.withoutFail).toBeGreaterThan(without.withoutFail);
    expect((withShelf.rejectedByRule['suppressed-leads'] ?? 0)).toBeLessThan(without.rejectedByRule['suppressed-leads'] ?? 0);
    expect(withShelf.top.some((t) => t.leadsIndex >= 0 || t.plugIndex >= 0)).toBe(true);
    for (const t of withShelf.top) {
      if (t.tachIndex >= 0 || t.leadsIndex >= 0 || t.plugIndex >= 0) {
        expect(t.report.verdict).not.toBe('fail');
        expect(t.report.label).toMatch(/; fit /);
      }
    }
    // A module whose maximum supply is below the running supply never ranks among those without a fail.
    for (const t of withShelf.top) if (plain.modules[t.moduleIndex]!.supplyMaxV < 14) expect(t.report.verdict).toBe('fail');
  });
});

// ---------------------------------------------------------------------------------------------
// Rules' fail tests.

/** Setups the search never builds: points, magneto, a wrongly wired coil, a left-over condenser, feeds after the ballast, missing parts. */
function oddSetups(): SetupSpec[] {
  const cl = module();
  const cd = cdModule();
  return [
    pointsSetup(),
    pointsSetup({ condenserF: null, coil: coil({ primaryResistanceOhm20C: { value: 1.2, provenance: 'measured' } }) }),
    pointsSetup({ coilWiring: 'reversed', coil: coil({ turnsRatio: 45 }), plugGapM: 1.1e-3 }),
    pointsSetup({ switching: 'magneto', magneto: { ratedCurrentA: 3.5, fullOutputRpm: 1200 }, tach: { name: 'Tach', senses: 'module-output' } }),
    pointsSetup({ switching: 'magneto', magneto: null }),
    moduleSetup(cl, { module: null }),
    moduleSetup(cl, { condenserF: 0.22e-6, ballast: ironBallast(), moduleFeed: 'after-ballast', tach: { name: 'Tach', senses: 'coil-supply-current' } }),
    moduleSetup(cd, { condenserF: 0.22e-6, ballast: ironBallast(), moduleFeed: 'after-ballast', crankingBypass: true, tach: { name: 'Tach', senses: 'coil-supply-current' } }),
    moduleSetup(cd, { module: { ...cd, cd: null } }),
    moduleSetup({ ...cl, moduleType: 'transistor-points', currentLimitA: null, maxDutyFraction: null, stallShutOff: false }, { coilWiring: 'reversed', plugGapM: 1.1e-3, coil: coil({ turnsRatio: 50 }) }),
    moduleSetup({ ...cl, needsSuppressedLeads: true }, { leads: { name: 'Copper', core: 'copper', resistancePerLeadOhm: 0 }, plugGapM: Number.NaN }),
    // A six-volt unit (4.5 to 9 V) on a 12 V car: over its maximum whenever the engine runs.
    moduleSetup({ ...cl, name: 'Six-volt unit', supplyMinV: 4.5, supplyMaxV: 9 }),
    // A fixed-duty module holding a current limit for most of a long dwell burns tens of watts.
    moduleSetup({ ...cl, name: 'Hot fixed duty', moduleType: 'breakerless-fixed-duty', fixedDutyFraction: 0.7, maxDutyFraction: null }, { coil: coil({ primaryResistanceOhm20C: { value: 0.6, provenance: 'catalogue' } }) }),
  ];
}

describe("each rule's fail test", () => {
  it('is listed in report order, one per rule', () => {
    const a = analyse(createSession(fourCylinder), pointsSetup(), null, false);
    expect(FAIL_TESTS.map(([id]) => id)).toEqual(a.rules.map((r) => r.id));
    expect(FAIL_TESTS).toHaveLength(RULES.length);
  });

  it("fails exactly when the rule's verdict is fail, on every generated combination and odd setup", () => {
    const disagreements: string[] = [];
    const failedSomewhere = new Set<RuleId>();
    const passedSomewhere = new Set<RuleId>();
    for (const [, input] of cases) {
      const s = createSession(input.engine, input.conditions, input.options);
      const base = baselineOf(analyse(s, input.existing, null, false));
      const setups = [...combinations(input).map((c) => c.setup), ...oddSetups()];
      for (const setup of setups) {
        for (const withGap of [false, true]) {
          const a = analyse(s, setup, base, withGap);
          FAIL_TESTS.forEach(([id, fails], k) => {
            const verdict = a.rules[k]!.verdict;
            if (fails(a.ctx) !== (verdict === 'fail')) disagreements.push(`${setup.label}: ${id} fail test says ${fails(a.ctx)}, rule says ${verdict}`);
            (verdict === 'fail' ? failedSomewhere : passedSomewhere).add(id);
          });
        }
      }
    }
    expect(disagreements).toEqual([]);
    // Every rule that can fail does so somewhere here, and passes somewhere else.
    expect([...failedSomewhere].sort()).toEqual(FAIL_TESTS.map(([id]) => id).filter((id) => id !== 'plug-gap' && id !== 'total-advance').sort());
    expect(passedSomewhere.size).toBe(FAIL_TESTS.length);
  });
});

// ---------------------------------------------------------------------------------------------
// The cranking-bypass twin and the sweep.

const COLUMNS = ['supplyV', 'resistanceOhm', 'dwellS', 'offS', 'currentA', 'energyJ', 'availableV', 'requiredV', 'reserveRatio', 'riseS', 'durationS', 'fouledV', 'cdChargeV', 'multiSpark', 'noSpark', 'moduleW'] as const;
const columns = (ws: Workspace): number[][] => COLUMNS.map((k) => Array.from(ws[k]));

describe('the cranking-bypass twin', () => {
  const s = createSession(fourCylinder);
  const input = generatedSearch({ coils: 8, modules: 8, ballasts: 2, seed: 5 });
  const pairs: Array<[SetupSpec, SetupSpec]> = [];
  for (const c of combinations(input)) {
    if (c.ballastIndex < 0) continue;
    for (const moduleFeed of ['switched-15', 'after-ballast'] as const) pairs.push([{ ...c.setup, moduleFeed, crankingBypass: false }, { ...c.setup, moduleFeed, crankingBypass: true }]);
  }
  const points = pointsSetup({ coil: coil({ forBallast: true, primaryResistanceOhm20C: { value: 1.5, provenance: 'catalogue' } }), ballast: ironBallast() });
  pairs.push([points, { ...points, crankingBypass: true }]);

  it('is what preparing that setup from scratch gives, either way round', () => {
    for (const [plain, bypassed] of pairs) {
      const p = prepareSetup(s.engine, plain, s.conditions, s.model);
      const q = prepareSetup(s.engine, bypassed, s.conditions, s.model);
      expect(withCrankingBypass(p, bypassed, s.conditions)).toEqual(q);
      expect(withCrankingBypass(q, plain, s.conditions)).toEqual(p);
    }
  });

  it('swept at its cranking points only, over its plain partner, gives its full sweep', () => {
    const ws = createWorkspace(s.grids.sweep.n);
    const fresh = createWorkspace(s.grids.sweep.n);
    let crankingDiffers = 0;
    for (const [plain, bypassed] of pairs) {
      const p = prepareSetup(s.engine, plain, s.conditions, s.model);
      const twin = withCrankingBypass(p, bypassed, s.conditions);
      evaluateGrid(p, s.grids.sweep, plain.plugGapM, ws);
      const before = columns(ws);
      evaluateGrid(twin, s.grids.sweep, plain.plugGapM, ws, undefined, { crankingOnly: true });
      evaluateGrid(prepareSetup(s.engine, bypassed, s.conditions, s.model), s.grids.sweep, plain.plugGapM, fresh);
      expect(columns(ws)).toEqual(columns(fresh));
      if (JSON.stringify(before) !== JSON.stringify(columns(fresh))) crankingDiffers++;
    }
    // The bypass matters: shorting the ballast out while cranking changes the cranking point of
    // most pairs (not CD ones fed from terminal 15, whose coil current does not flow from the battery).
    expect(crankingDiffers).toBeGreaterThan(pairs.length / 2);
  });
});

describe('the verdict-only sweep', () => {
  it('gives every column of the full sweep except the fouled-plug peak, which it leaves NaN', () => {
    const s = createSession(fourCylinder);
    const input = generatedSearch({ coils: 6, modules: 10, ballasts: 1, seed: 21 });
    const full = createWorkspace(s.grids.sweep.n);
    const verdict = createWorkspace(s.grids.sweep.n);
    const others = COLUMNS.filter((k) => k !== 'fouledV');
    for (const setup of [...combinations(input).map((c) => c.setup), ...oddSetups()]) {
      const p = prepareSetup(s.engine, setup, s.conditions, s.model);
      evaluateGrid(p, s.grids.sweep, 0.8e-3, full);
      evaluateGrid(p, s.grids.sweep, 0.8e-3, verdict, undefined, { verdictOnly: true });
      for (const k of others) expect(Array.from(verdict[k]), `${setup.label} ${k}`).toEqual(Array.from(full[k]));
      expect(Array.from(verdict.fouledV).every((v) => Number.isNaN(v)), setup.label).toBe(true);
    }
  });
});

describe("the verdict-only sweep's skipped spark durations", () => {
  it('leaves a duration out only where the off time cannot fail (off / duration >= the fail ratio), and gives every other column', () => {
    const s = createSession(fourCylinder);
    const input = generatedSearch({ coils: 6, modules: 10, ballasts: 1, seed: 23 });
    const full = createWorkspace(s.grids.sweep.n);
    const verdict = createWorkspace(s.grids.sweep.n);
    const others = COLUMNS.filter((k) => k !== 'fouledV' && k !== 'durationS');
    let skipped = 0;
    let kept = 0;
    for (const setup of [...combinations(input).map((c) => c.setup), ...oddSetups()]) {
      const p = prepareSetup(s.engine, setup, s.conditions, s.model);
      evaluateGrid(p, s.grids.sweep, 0.8e-3, full);
      evaluateGrid(p, s.grids.sweep, 0.8e-3, verdict, undefined, { verdictOnly: true, offTimeFailRatio: OFF_TIME_FAIL_RATIO });
      for (const k of others) expect(Array.from(verdict[k]), `${setup.label} ${k}`).toEqual(Array.from(full[k]));
      for (let i = 0; i < s.grids.sweep.n; i++) {
        if (Number.isNaN(verdict.durationS[i]!)) {
          skipped++;
          expect(full.offS[i]! / full.durationS[i]!, `${setup.label} point ${i}`).toBeGreaterThanOrEqual(OFF_TIME_FAIL_RATIO);
        } else {
          kept++;
          expect(verdict.durationS[i], `${setup.label} point ${i}`).toBe(full.durationS[i]);
        }
      }
    }
    expect(skipped).toBeGreaterThan(0);
    expect(kept).toBeGreaterThan(0);
  });
});

describe('the plug-gap bisection', () => {
  it('stops at the first rpm under the margin and still answers as the full worst-ratio scan does', () => {
    const input = generatedSearch({ coils: 6, modules: 8, ballasts: 1, seed: 13 });
    const setups = [...combinations(input).map((c) => c.setup), ...oddSetups()];
    const disagreements: string[] = [];
    // Points that float from 3500 rpm lose their dwell at the top, so there the reserve is worst at redline.
    const floating: EngineSpec = { ...fourCylinder, pointsFloatRpm: 3500 };
    for (const [engine, paschen] of [[fourCylinder, false], [fourCylinder, true], [floating, false]] as const) {
      const s = createSession(engine, undefined, { rpmPoints: 80, breakdownModel: paschen ? 'paschen' : 'empirical-air' });
      const g = s.grids.sweep;
      for (const setup of setups) {
        const a = analyse(s, setup, null, false);
        for (let gapM = 0.2e-3; gapM <= 2.2e-3; gapM += 0.05e-3) {
          for (const margin of [0.8, 1.25, s.margin * (1 + 1e-12)]) {
            for (const hint of [-1, 0, a.worstIndex, s.grids.redlineIndex]) {
              const full = worstRatioForGap(g, a.ws.availableV, s.grids.redlineIndex, gapM, paschen, a.prep.polarityFactor) >= margin;
              const quick = gapMeetsMargin(g, a.ws.availableV, s.grids.redlineIndex, gapM, paschen, a.prep.polarityFactor, margin, hint);
              if (full !== quick) disagreements.push(`${setup.label} at ${gapM} m, margin ${margin}, hint ${hint}: ${quick} against ${full}`);
            }
          }
        }
      }
    }
    expect(disagreements).toEqual([]);
  });
});

describe('the comparison', () => {
  it('reports each setup as checking it alone does, though the four share one workspace', () => {
    const input = generatedSearch({ coils: 4, modules: 4, ballasts: 1, seed: 17 });
    const candidates = combinations(input).filter((_, i) => i % 5 === 1).slice(0, 3).map((c) => c.setup);
    const existing = pointsSetup();
    const got = compareSetups({ engine: fourCylinder, existing, candidates });
    const alone = checkSetup(fourCylinder, existing);
    expect(got.existing).toEqual(alone);
    const baseline = { ...alone, label: 'the existing setup' };
    got.candidates.forEach((r, i) => expect(r).toEqual(checkSetup(fourCylinder, candidates[i]!, undefined, undefined, baseline)));
  });
});

describe('the sweep, point by point', () => {
  it('gives the dwell, break current, energy, spark duration and fouled peak of the laws evaluated at each point alone', () => {
    // An engine that idles at its cranking speed puts a cranking and a running point at the same
    // rpm on the key grid: nothing carried from one point to the next may cross the supply case.
    const slowIdle: EngineSpec = { ...fourCylinder, idleRpm: 400, crankingRpm: 400 };
    const input = generatedSearch({ coils: 6, modules: 12, ballasts: 1, seed: 9 });
    const setups = [...combinations(input).map((c) => c.setup), ...oddSetups()];
    for (const engine of [fourCylinder, slowIdle]) {
      const s = createSession(engine, undefined, { rpmPoints: 120 });
      for (const g of [s.grids.sweep, s.grids.key]) expect(pointByPointMismatches(s, g, setups)).toEqual([]);
    }
  });
});

/** Points where a column differs from the law evaluated at that point alone, as readable strings. */
function pointByPointMismatches(s: ReturnType<typeof createSession>, g: ReturnType<typeof createSession>['grids']['sweep'], setups: SetupSpec[]): string[] {
  const out: string[] = [];
  const check = (what: string, setup: SetupSpec, i: number, got: number, want: number): void => {
    if (!Object.is(got, want)) out.push(`${setup.label} ${what} at point ${i}: ${got} against ${want}`);
  };
  const ws = createWorkspace(g.n);
  for (const setup of setups) {
    const p = prepareSetup(s.engine, setup, s.conditions, s.model);
    evaluateGrid(p, g, 0.7e-3, ws);
    for (let i = 0; i < g.n; i++) {
      if (ws.noSpark[i] === 1) {
        // A module below its minimum supply does not switch: no current, so 0.5 L i^2 = 0 and no voltage.
        for (const [what, v] of [['break current', ws.currentA[i]!], ['energy', ws.energyJ[i]!], ['available', ws.availableV[i]!], ['reserve', ws.reserveRatio[i]!]] as const) check(what, setup, i, v, 0);
        continue;
      }
      const cranking = g.cranking[i] === 1;
      const perRpm = p.ironBallast !== null && !cranking;
      // An iron ballast settles at each running rpm's own mean-square current (ballast.ts), so
      // there the circuit follows from the point's resistance; otherwise from the supply case.
      const iFinal = perRpm ? finalCurrentA(ws.supplyV[i]!, p.switchDropV, ws.resistanceOhm[i]!) : cranking ? p.iFinalCrankingA : g.resting[i] === 1 ? p.iFinalRestingA : p.iFinalRunningA;
      const tau = perRpm ? p.primaryInductanceH / ws.resistanceOhm[i]! : cranking ? p.tauCrankingS : p.tauRunningS;
      if (perRpm) {
        // Steady-state energy balance T = T_amb + theta <i^2> R(T) (Incropera & DeWitt), the
        // resistance being the rest of the circuit plus R(T), to the solver's tolerance.
        const b = p.ironBallast!;
        const tK = ws.ballastK[i]!;
        const rb = ironBallastResistanceOhm(b.coldOhm, tK);
        check('ballast resistance', setup, i, ws.resistanceOhm[i]!, b.restOhm + rb);
        const ms = meanSquareCurrentA2(iFinal, tau, dwellTimeS(p, g.periodS[i]!, g.rpm[i]!, iFinal, tau), g.periodS[i]!, p.limitA);
        const residualK = b.ambientK + b.thetaKPerW * ms * rb - tK;
        // The solver stops once its next step would be under 1e-4 K (the slope is of order -1).
        if (!(Math.abs(residualK) < 1e-3)) out.push(`${setup.label} ballast balance at point ${i}: ${residualK} K off`);
      }
      if (p.mode === DwellMode.Cd) {
        // Fouled plug on CD: the clean peak times the constant-current-pulse fraction (fouled.ts).
        check('fouled peak', setup, i, ws.fouledV[i]!, ws.availableV[i]! * cdFouledFraction(ws.riseS[i]!, p.fouledShuntOhm, p.secondaryCapacitanceF));
        continue;
      }
      const dwell = dwellTimeS(p, g.periodS[i]!, g.rpm[i]!, p.mode === DwellMode.Magneto ? 0 : iFinal, tau);
      check('dwell', setup, i, ws.dwellS[i]!, dwell);
      // RL charge i = I_final (1 - e^(-t/tau)), capped by the module's current limit (charge.ts).
      if (p.mode !== DwellMode.Magneto) check('break current', setup, i, ws.currentA[i]!, Math.min(chargeCurrentA(iFinal, tau, dwell), p.limitA));
      const current = ws.currentA[i]!;
      check('energy', setup, i, ws.energyJ[i]!, 0.5 * p.primaryInductanceH * current * current);
      // t = (Ls/Rs) ln(1 + Rs Is0 / V_arc), Is0 = eta i / n (secondary.ts).
      check('spark duration', setup, i, ws.durationS[i]!, inductiveSparkDurationS(p.secondaryInductanceH, p.secondaryResistanceOhm, (p.eta * current) / p.n, p.arcV));
      // Fouled plug: the flux current of a charge loaded by the reflected shunt (Thevenin seen by
      // Lp, fouled.ts), times the parallel-RLC peak per ampere, capped by the clamp; a magneto
      // keeps its clean break current.
      const r = ws.resistanceOhm[i]!;
      const rsh = reflectedShuntOhm(p.fouledShuntOhm, p.secondaryResistanceOhm, p.n);
      const tauF = fouledChargeTauS(tau, r, rsh);
      const flux = p.mode === DwellMode.Magneto ? current : fouledFluxCurrentA(iFinal, tauF, dwell, p.limitA, fouledTimeToLimitS(iFinal, tauF, r, rsh, p.limitA), p.primaryInductanceH / rsh);
      check('fouled peak', setup, i, ws.fouledV[i]!, Math.min(flux * p.fouledVPerA, p.capV));
    }
  }
  return out;
}
