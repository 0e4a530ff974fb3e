/**
 * The check session (session.ts): the required voltage shared between setups by gap and polarity,
 * the margin taken when the conditions give none that is usable, the gap assumed when a setup's own
 * is unusable (and said so, and handed to the rules), the first rpm under the margin, the worst
 * reserve and where, and the gap suggestion under the breakdown law the session was asked for.
 * Written against the mutation-testing survivors (npm run mutate).
 *
 * Sources, each named again beside its check:
 * - the empirical air breakdown law V_kV = 24.22 x + 6.08 sqrt(x), x the density-reduced gap in cm,
 *   x = gap_cm (p / 1 atm)(293 K / T), 1 atm = 101 325 Pa (as documented in breakdown.ts);
 * - Paschen's law V = B pd / (ln(A pd) - ln(ln(1 + 1/gamma))) with A = 15 /(cm Torr),
 *   B = 365 V/(cm Torr), gamma = 0.01, pd = 760 Torr x the reduced gap in cm, held at its minimum
 *   left of it (breakdown.ts's stated constants), solved for the gap by a bisection in this file;
 * - a reversed coil needs 1 / 0.9 of the correctly wired requirement (breakdown.ts: a negative
 *   centre electrode needs roughly 10 % less voltage, club technical literature);
 * - the reserve ratio is available / required (types.ts, OperatingPoint), and the available voltage
 *   never exceeds the coil's rated secondary voltage (types.ts, CoilSpec.ratedSecondaryV): with a
 *   low rating every point sits at the rating, so the available voltage is that stated number;
 * - the voltage margin 1.25 (conditions.ts, marginRatio, common practice), which session.ts's
 *   comment and code take whenever the conditions give a margin that is not positive;
 * - the gap assumed when the setup's is missing or not positive: 0.7 mm (session.ts, gapOf's
 *   documented contract: "else 0.7 mm (and the setup-complete rule says so)");
 * - the documented contracts of the analysis (types.ts SetupReport): the lowest reserve from cranking
 *   to redline and where; the lowest running rpm up to 110 % of redline under the margin, null if
 *   never; the suggested gap rounded down to 0.01 mm (gap.ts) within the plug's range.
 */
import { describe, expect, it } from 'vitest';
import { compareSetups } from '../../electron/checker/index.js';
import type { CoilWiring, ConditionInputs, OperatingPoint, SetupSpec } from '../../electron/checker/index.js';
import { analyse, createSession, worstReserve, type Session } from '../../electron/checker/session.js';
import { createWorkspace } from '../../electron/checker/sweep.js';
import { coil, fourCylinder, pointsSetup } from './fixtures.js';
import { airV, paschenV } from './worked-laws.js';

const OPTIONS = { rpmPoints: 12 };

/** 1 atm in Pa and the reference temperature of the reduced gap (breakdown.ts). */
const ATM = 101_325;
const T_REF = 293;
/** A reversed coil needs 1 / 0.9 of the requirement (breakdown.ts). */
const REVERSED = 1 / 0.9;
/** The margin when the conditions give none that is positive (conditions.ts, common practice). */
const DEFAULT_MARGIN = 1.25;
/** The gap assumed for a missing or non-positive one (session.ts, gapOf). */
const ASSUMED_GAP_M = 0.7e-3;
const GAP_SENTENCE = 'The plug gap is missing or not positive; 0.7 mm was assumed.';

/** A coil rated far below what the circuit reaches, so every point's available voltage is the rating. */
const RATING_V = 12_000;
const lowRated = (over: Partial<SetupSpec> = {}): SetupSpec => pointsSetup({ coil: coil({ ratedSecondaryV: RATING_V }), ...over });

const margin = (value: number): ConditionInputs => ({ marginRatio: { value, provenance: 'engine override' } });

const close = (got: number, want: number, what: string, rel = 1e-9): void => {
  if (!(Math.abs(got - want) <= rel * Math.abs(want))) expect.fail(`${what}: ${got}, expected ${want}`);
};

/** The required voltage the air law gives at a reported point (its cylinder pressure and temperature). */
function airRequiredAt(pt: OperatingPoint, gapM: number, polarity: number): number {
  const x = gapM * 100 * (pt.cylinderPressurePa / ATM) * (T_REF / pt.cylinderTemperatureK);
  return airV(x) * polarity;
}

/** Every point's required voltage and reserve against the air law, for the gap and wiring given. */
function expectAirLaw(points: OperatingPoint[], gapM: number, polarity: number, label: string): void {
  points.forEach((pt, i) => {
    const req = airRequiredAt(pt, gapM, polarity);
    close(pt.requiredV, req, `${label}, point ${i} required voltage (air law)`);
    close(pt.reserveRatio, pt.availableV / req, `${label}, point ${i} reserve (available / required)`);
  });
}

// ---------------------------------------------------------------- required voltage per gap and polarity

describe('required voltage is worked for each setup\'s own gap and polarity (one session, one comparison)', () => {
  it('a candidate with another plug gap gets the air law at its own gap, not the existing one\'s', () => {
    const existing = pointsSetup({ label: 'Existing, 0.7 mm', plugGapM: 0.7e-3 });
    const wide = pointsSetup({ label: 'Candidate, 1.0 mm', plugGapM: 1.0e-3 });
    const narrow = pointsSetup({ label: 'Candidate, 0.6 mm', plugGapM: 0.6e-3 });
    const back = pointsSetup({ label: 'Candidate, 0.7 mm again', plugGapM: 0.7e-3 });
    const r = compareSetups({ engine: fourCylinder, existing, candidates: [wide, narrow, back], options: OPTIONS });
    // Empirical air law at x = gap_cm (p / 1 atm)(293 K / T) (breakdown.ts).
    expectAirLaw(r.existing.points, 0.7e-3, 1, 'existing');
    expectAirLaw(r.candidates[0]!.points, 1.0e-3, 1, '1.0 mm');
    expectAirLaw(r.candidates[1]!.points, 0.6e-3, 1, '0.6 mm');
    expectAirLaw(r.candidates[2]!.points, 0.7e-3, 1, '0.7 mm again');
    // The wider gap needs more at every point (the law rises with x).
    r.existing.points.forEach((pt, i) => expect(r.candidates[0]!.points[i]!.requiredV).toBeGreaterThan(pt.requiredV));
  });

  it('a candidate with the coil reversed gets 1 / 0.9 of the requirement at the same gap', () => {
    const wiring = (w: CoilWiring, label: string): SetupSpec => pointsSetup({ label, coilWiring: w, plugGapM: 0.8e-3 });
    const r = compareSetups({
      engine: fourCylinder,
      existing: wiring('as-marked-for-earth', 'Existing, as marked'),
      candidates: [wiring('reversed', 'Candidate, reversed'), wiring('as-marked-for-earth', 'Candidate, as marked')],
      options: OPTIONS,
    });
    // Air law x 1 for the coil as marked, x 1 / 0.9 reversed (breakdown.ts, REVERSED_POLARITY_FACTOR's source).
    expectAirLaw(r.existing.points, 0.8e-3, 1, 'as marked');
    expectAirLaw(r.candidates[0]!.points, 0.8e-3, REVERSED, 'reversed');
    expectAirLaw(r.candidates[1]!.points, 0.8e-3, 1, 'as marked again');
  });

  it('the same in analyses of one session one after the other (gap, then wiring, then both back)', () => {
    const s = createSession(fourCylinder, undefined, OPTIONS);
    const df = s.grids.sweep.densityFactor;
    const cases: Array<[gapM: number, wiring: CoilWiring, polarity: number]> = [
      [0.7e-3, 'as-marked-for-earth', 1],
      [0.9e-3, 'as-marked-for-earth', 1],
      [0.9e-3, 'reversed', REVERSED],
      [0.7e-3, 'reversed', REVERSED],
      [0.7e-3, 'as-marked-for-earth', 1],
    ];
    for (const [gapM, coilWiring, polarity] of cases) {
      const a = analyse(s, pointsSetup({ plugGapM: gapM, coilWiring }), null, false);
      // Air law at the grid's reduced density (p / 1 atm)(293 K / T), times the polarity factor (breakdown.ts).
      for (let i = 0; i < s.grids.sweep.n; i++) close(a.ws.requiredV[i]!, airV(gapM * 100 * df[i]!) * polarity, `${gapM} m ${coilWiring}, point ${i}`, 1e-12);
    }
  });
});

// ---------------------------------------------------------------- Paschen's law on request

/** The largest gap (m) in [lo, hi] whose worst reserve over points 0..last meets the margin, by bisection on Paschen's law. */
function paschenEdgeM(df: Float64Array, last: number, availableV: number, m: number, lo: number, hi: number): number {
  const meets = (g: number): boolean => {
    for (let i = 0; i <= last; i++) if (availableV / paschenV(g * 100 * df[i]!) < m) return false;
    return true;
  };
  expect(meets(lo)).toBe(true);
  expect(meets(hi)).toBe(false);
  let a = lo;
  let b = hi;
  for (let k = 0; k < 200; k++) {
    const mid = 0.5 * (a + b);
    if (meets(mid)) a = mid;
    else b = mid;
  }
  return a;
}

describe('a session on Paschen\'s law uses it for the required voltage and the gap suggestion', () => {
  const plug = { name: 'Wide-range plug', resistor: false, resistorOhm: 0, gapMinM: 0.3e-3, gapMaxM: 2.0e-3 };

  it('required voltage by Paschen\'s law at every point', () => {
    const s = createSession(fourCylinder, undefined, { ...OPTIONS, breakdownModel: 'paschen' });
    const df = s.grids.sweep.densityFactor;
    const a = analyse(s, pointsSetup({ plugGapM: 0.8e-3 }), null, false);
    for (let i = 0; i < s.grids.sweep.n; i++) {
      // Paschen at pd = 760 x Torr cm (breakdown.ts constants); about 17 % above the air law here.
      const want = paschenV(0.8e-3 * 100 * df[i]!);
      close(a.ws.requiredV[i]!, want, `Paschen, point ${i}`, 1e-12);
      expect(Math.abs(want / airV(0.8e-3 * 100 * df[i]!) - 1)).toBeGreaterThan(0.05);
    }
  });

  it('the suggested gap is Paschen\'s edge at the margin, rounded down to 0.01 mm', () => {
    const s = createSession(fourCylinder, undefined, { ...OPTIONS, breakdownModel: 'paschen' });
    const a = analyse(s, lowRated({ plug, plugGapM: 0.8e-3 }), null, true);
    const last = s.grids.redlineIndex;
    // Precondition: the coil's rating is what every point has available (types.ts, ratedSecondaryV).
    for (let i = 0; i <= last; i++) expect(a.ws.availableV[i]).toBe(RATING_V);
    const df = s.grids.sweep.densityFactor;
    const edge = paschenEdgeM(df, last, RATING_V, DEFAULT_MARGIN, plug.gapMinM, plug.gapMaxM);
    const frac = edge * 1e5 - Math.floor(edge * 1e5);
    expect(frac > 1e-6 && frac < 1 - 1e-6).toBe(true); // not on a 0.01 mm step, so the rounding is unambiguous
    const want = Math.floor(edge * 1e5) / 1e5;
    expect(a.gap).toEqual({ suggestedGapM: want, searchedFromM: plug.gapMinM, searchedToM: plug.gapMaxM, marginRatio: DEFAULT_MARGIN });
    // The air law would allow a wider gap (Paschen reads higher): the law used is told apart.
    let airEdge = 0;
    for (let g = plug.gapMinM; g <= plug.gapMaxM; g += 1e-5) {
      let ok = true;
      for (let i = 0; i <= last; i++) if (RATING_V / airV(g * 100 * df[i]!) < DEFAULT_MARGIN) ok = false;
      if (ok) airEdge = g;
    }
    expect(airEdge).toBeGreaterThan(want + 2e-5);
  });

  it('no suggestion unless asked for', () => {
    const s = createSession(fourCylinder, undefined, { ...OPTIONS, breakdownModel: 'paschen' });
    expect(analyse(s, lowRated({ plug }), null, false).gap).toBeNull();
    expect(analyse(s, lowRated({ plug }), null, true).gap).not.toBeNull();
  });
});

// ---------------------------------------------------------------- the margin

describe('the margin: the conditions\' own when positive, else 1.25', () => {
  const cases: Array<[given: number, want: number, why: string]> = [
    [1.5, 1.5, 'a positive margin is used as given'],
    [1.0001, 1.0001, 'a margin just above one is used as given'],
    [0, DEFAULT_MARGIN, 'zero is not positive: 1.25 (conditions.ts, common practice)'],
    [-2, DEFAULT_MARGIN, 'a negative margin is not positive: 1.25 (conditions.ts, common practice)'],
  ];
  for (const [given, want, why] of cases) {
    it(`${given}: ${why}`, () => {
      const s = createSession(fourCylinder, margin(given), OPTIONS);
      expect(s.margin).toBe(want);
      const a = analyse(s, pointsSetup(), null, true);
      expect(a.ctx.margin).toBe(want);
      expect(a.gap!.marginRatio).toBe(want);
    });
  }
  it('no conditions at all: 1.25 (conditions.ts default, common practice)', () => {
    expect(createSession(fourCylinder, undefined, OPTIONS).margin).toBe(DEFAULT_MARGIN);
  });
});

// ---------------------------------------------------------------- the gap assumed

describe('a missing or non-positive gap: 0.7 mm assumed, said so, and handed to the rules', () => {
  const bad: Array<[string, number]> = [['NaN', NaN], ['zero', 0], ['negative', -0.5e-3], ['infinite', Infinity], ['minus infinity', -Infinity]];
  for (const [name, gapM] of bad) {
    it(`${name} gap`, () => {
      const s = createSession(fourCylinder, undefined, OPTIONS);
      const setup = pointsSetup({ plugGapM: gapM });
      const a = analyse(s, setup, null, true);
      // Required voltage by the air law at 0.7 mm (gapOf's documented fallback, breakdown.ts law).
      const df = s.grids.sweep.densityFactor;
      for (let i = 0; i < s.grids.sweep.n; i++) close(a.ws.requiredV[i]!, airV(ASSUMED_GAP_M * 100 * df[i]!), `point ${i}`, 1e-12);
      // Said once, in the words of gapOf, and the setup-complete rule fails with them.
      expect(a.prep.issues.filter((t) => t === GAP_SENTENCE)).toHaveLength(1);
      const complete = a.rules.find((r) => r.id === 'setup-complete')!;
      expect(complete.verdict).toBe('fail');
      expect(complete.why).toContain(GAP_SENTENCE);
      // The rules read the setup with the gap assumed; the caller's setup is left as it was.
      expect(a.ctx.setup.plugGapM).toBe(ASSUMED_GAP_M);
      expect(a.ctx.setup).toEqual({ ...setup, plugGapM: ASSUMED_GAP_M });
      expect(setup.plugGapM).toBe(gapM);
      const gapSet = a.rules.find((r) => r.id === 'plug-gap')!.figures.find((f) => f.name === 'gap set')!;
      close(gapSet.value, 0.7, 'plug-gap rule, gap set (mm)', 1e-12);
    });
  }

  it('a usable gap is used as given, with no issue, and the rules read the caller\'s own setup', () => {
    const s = createSession(fourCylinder, undefined, OPTIONS);
    const setup = pointsSetup({ plugGapM: 0.9e-3 });
    const a = analyse(s, setup, null, true);
    const df = s.grids.sweep.densityFactor;
    for (let i = 0; i < s.grids.sweep.n; i++) close(a.ws.requiredV[i]!, airV(0.9e-3 * 100 * df[i]!), `point ${i}`, 1e-12);
    expect(a.prep.issues).not.toContain(GAP_SENTENCE);
    expect(a.ctx.setup).toBe(setup);
    expect(a.rules.find((r) => r.id === 'plug-gap')!.figures.find((f) => f.name === 'gap set')!.value).toBeCloseTo(0.9, 12);
  });
});

// ---------------------------------------------------------------- first rpm under the margin

/** Available / required by the air law at point i (the rating available, types.ts; breakdown.ts law). */
const lawReserve = (s: Session, gapM: number, i: number): number => RATING_V / (airV(gapM * 100 * s.grids.sweep.densityFactor[i]!) * 1);

describe('the first running rpm at or above idle whose reserve is under the margin', () => {
  const gapM = 0.7e-3;
  /** Running points at or above idle: the ones the contract reads. */
  const running = (s: Session): number[] => {
    const out: number[] = [];
    for (let i = 1; i < s.grids.sweep.n; i++) if (s.grids.sweep.rpm[i]! >= fourCylinder.idleRpm) out.push(i);
    return out;
  };

  it('a reserve exactly at the margin is not under it: none (null rpm)', () => {
    const probe = createSession(fourCylinder, undefined, OPTIONS);
    const idx = running(probe);
    // The lowest reserve over the running points, by the law: the margin is set to exactly that.
    const lowest = Math.min(...idx.map((i) => lawReserve(probe, gapM, i)));
    const s = createSession(fourCylinder, margin(lowest), OPTIONS);
    expect(s.margin).toBe(lowest);
    const a = analyse(s, lowRated({ plugGapM: gapM }), null, false);
    for (const i of idx) expect(a.ws.reserveRatio[i]).toBe(lawReserve(s, gapM, i)); // the law, to the last bit
    expect(a.belowMarginIndex).toBe(-1);
  });

  it('every running reserve above the margin: none', () => {
    const s = createSession(fourCylinder, margin(0.5), OPTIONS);
    const a = analyse(s, lowRated({ plugGapM: gapM }), null, false);
    for (const i of running(s)) expect(lawReserve(s, gapM, i)).toBeGreaterThan(0.5);
    expect(a.belowMarginIndex).toBe(-1);
  });

  it('a margin just above one point\'s reserve: that point and no other', () => {
    const probe = createSession(fourCylinder, undefined, OPTIONS);
    const idx = running(probe);
    const r = idx.map((i) => lawReserve(probe, gapM, i));
    // The second-lowest reserve sets the margin (a hair above the lowest): only the lowest falls under it.
    const sorted = [...r].sort((x, y) => x - y);
    const m = (sorted[0]! + sorted[1]!) / 2;
    const want = idx[r.indexOf(sorted[0]!)]!;
    const s = createSession(fourCylinder, margin(m), OPTIONS);
    const a = analyse(s, lowRated({ plugGapM: gapM }), null, false);
    expect(a.belowMarginIndex).toBe(want);
    // And under a margin above every reserve: the first running point (idle).
    const s2 = createSession(fourCylinder, margin(sorted[sorted.length - 1]! * 1.01), OPTIONS);
    expect(analyse(s2, lowRated({ plugGapM: gapM }), null, false).belowMarginIndex).toBe(idx[0]);
  });
});

// ---------------------------------------------------------------- the worst reserve

describe('worstReserve: the lowest reserve over cranking..last, and the first point where it is', () => {
  const ws = (r: number[]) => {
    const w = createWorkspace(r.length);
    w.reserveRatio.set(r);
    return w;
  };
  it('the worst at the last point read is found', () => {
    expect(worstReserve(ws([3, 2, 4, 1]), 3)).toEqual({ worstRatio: 1, worstIndex: 3 });
  });
  it('points past `last` are not read', () => {
    expect(worstReserve(ws([3, 2, 4, 1]), 2)).toEqual({ worstRatio: 2, worstIndex: 1 });
  });
  it('a tie keeps the first point where the lowest is reached', () => {
    expect(worstReserve(ws([3, 2, 2, 5]), 3)).toEqual({ worstRatio: 2, worstIndex: 1 });
    expect(worstReserve(ws([1.5, 1.5, 1.5]), 2)).toEqual({ worstRatio: 1.5, worstIndex: 0 });
  });
  it('no point with a ratio: Infinity at 0 (its comment)', () => {
    expect(worstReserve(ws([NaN, NaN]), 1)).toEqual({ worstRatio: Infinity, worstIndex: 0 });
  });
});
