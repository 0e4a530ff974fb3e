/**
 * The plug-gap suggestion (gap.ts), the running iron ballast's heating solution (ballast.ts) and the
 * sweep's rpm points (grid.ts), driven into the branches no other test reaches and held at their
 * edges. Written against the mutation-testing survivors (npm run mutate).
 *
 * Sources: the empirical air breakdown law V_kV = 24.22 x + 6.08 sqrt(x), x the density-reduced
 * gap in cm (as named in breakdown.ts), solved by hand for the gap where available / required
 * equals the margin; Paschen's law V = B pd / (ln(A pd) - ln(ln(1 + 1/gamma))) with A = 15 /(cm
 * Torr), B = 365 V/(cm Torr), gamma = 0.01, held at its minimum left of it (breakdown.ts's stated
 * constants), solved by a bisection in this file; the steady-state energy balance of a self-heated
 * resistor T = T_amb + theta <i^2> R(T) (Incropera & DeWitt, ch. 1 and 3) with R from the iron
 * resistivity table (the code's own values, from memory, restated here), i from Ohm's law and the
 * RL step i = I_f (1 - e^(-t/tau)) (any circuits text), its mean square integrated in closed form;
 * the sweep's documented contract (grid.ts: rising, round values, cranking, idle and redline
 * exact, the count asked).
 */
import { describe, expect, it } from 'vitest';
import { DEFAULT_GAP_RANGE_M, gapMeetsMargin, suggestGap, worstRatioForGap } from '../../electron/checker/gap.js';
import { RunningBallast } from '../../electron/checker/ballast.js';
import { DwellMode, type DwellParams } from '../../electron/checker/timing.js';
import { buildGrids, sweepRpm, type RpmGrid } from '../../electron/checker/grid.js';
import { resolveConditions } from '../../electron/checker/conditions.js';
import type { EngineSpec, PlugSpec } from '../../electron/checker/types.js';
import { fourCylinder } from './fixtures.js';
import { airV, gridOf, ironRho, paschenV } from './worked-laws.js';

// ---------------------------------------------------------------- the gap



// Five points: cranking then four running speeds; the reserve is worst at index 3 (worked below).
const DF = [1.2, 9, 12, 10, 7];
const AV = Float64Array.from([14000, 30000, 34000, 28000, 22000]);
const G = gridOf({ densityFactor: DF });

/** Available / required at each point for a gap (metres), computed in the same order as the law reads. */
function ratios(gapM: number, law: (x: number) => number, polarity: number, last = DF.length - 1): number[] {
  const out: number[] = [];
  for (let i = 0; i <= last; i++) out.push(AV[i]! / (law(gapM * 100 * DF[i]!) * polarity));
  return out;
}

/** The gap (m) where one point's air-law reserve equals the margin: 24.22 s^2 + 6.08 s = V_kV / (m p), s = sqrt(x). */
function airEdgeM(df: number, availableV: number, margin: number, polarity: number): number {
  const v = availableV / (1000 * margin * polarity);
  const s = (-6.08 + Math.sqrt(6.08 * 6.08 + 4 * 24.22 * v)) / (2 * 24.22);
  return (s * s) / df / 100;
}

const plug = (minM: number, maxM: number): PlugSpec => ({ name: 'Test plug', resistor: false, resistorOhm: 0, gapMinM: minM, gapMaxM: maxM });

describe('worst reserve over the grid for one gap (air law and Paschen law, by hand)', () => {
  it('is the smallest available / required over points 0..lastIndex, a middle point the worst', () => {
    const r = ratios(0.8e-3, airV, 1);
    // At 0.8 mm: 3.33, 1.33, 1.16, 1.13, 1.22 - the fourth point (index 3) is the worst, not the last.
    expect(Math.min(...r)).toBe(r[3]);
    expect(worstRatioForGap(G, AV, 4, 0.8e-3, false, 1)).toBeCloseTo(r[3]!, 12);
    expect(r[3]).toBeGreaterThan(1.12);
    expect(r[3]).toBeLessThan(1.14);
  });
  it('reads the last point it is given and none past it', () => {
    // lastIndex 3: the worst is the last point read; lastIndex 2: the worse point 3 is not read.
    expect(worstRatioForGap(G, AV, 3, 0.8e-3, false, 1)).toBeCloseTo(ratios(0.8e-3, airV, 1)[3]!, 12);
    const r2 = ratios(0.8e-3, airV, 1, 2);
    expect(worstRatioForGap(G, AV, 2, 0.8e-3, false, 1)).toBeCloseTo(Math.min(...r2), 12);
    expect(Math.min(...r2)).toBe(r2[2]);
  });
  it('a reversed coil needs 1/0.9 of the voltage: the reserve falls by 0.9', () => {
    const r = ratios(0.8e-3, airV, 1 / 0.9);
    expect(worstRatioForGap(G, AV, 4, 0.8e-3, false, 1 / 0.9)).toBeCloseTo(Math.min(...r), 12);
    expect(Math.min(...r)).toBeCloseTo(0.9 * Math.min(...ratios(0.8e-3, airV, 1)), 12);
  });
  it('under Paschen\'s law', () => {
    const r = ratios(0.8e-3, paschenV, 1);
    expect(worstRatioForGap(G, AV, 4, 0.8e-3, true, 1)).toBeCloseTo(Math.min(...r), 12);
    // Paschen reads higher than the empirical law here, so its reserve is smaller.
    expect(Math.min(...r)).toBeLessThan(Math.min(...ratios(0.8e-3, airV, 1)));
  });
  it('a gap that needs nothing reads 1e6 (the stated stand-in); no points read 0', () => {
    expect(worstRatioForGap(G, AV, 4, 0, false, 1)).toBe(1e6);
    expect(worstRatioForGap(G, AV, -1, 0.8e-3, false, 1)).toBe(0);
  });
});

describe('whether a gap meets the margin (same answer as the full scan, worst ratio >= margin)', () => {
  const worst = (gapM: number, last = 4): number => Math.min(...ratios(gapM, airV, 1, last));
  it('with no margin (<= 0 or not a number) answers worst >= margin straight from the full scan', () => {
    expect(gapMeetsMargin(G, AV, 4, 0.8e-3, false, 1, 0, 3)).toBe(true);
    expect(gapMeetsMargin(G, AV, 4, 0.8e-3, false, 1, -1, 3)).toBe(true);
    expect(gapMeetsMargin(G, AV, 4, 0.8e-3, false, 1, Number.NaN, 3)).toBe(false);
    // No points: the worst ratio reads 0, and 0 >= 0.
    expect(gapMeetsMargin(G, AV, -1, 0.8e-3, false, 1, 0, 0)).toBe(true);
    expect(gapMeetsMargin(G, AV, -1, 0.8e-3, false, 1, -0.5, 0)).toBe(true);
    // ... but it does not meet a positive margin.
    expect(gapMeetsMargin(G, AV, -1, 0.8e-3, false, 1, 0.5, 0)).toBe(false);
  });
  it('a margin equal to the worst ratio is met; one a hair above is not (either hint)', () => {
    const m = worst(0.8e-3);
    for (const hint of [3, 1, -1, 7]) {
      expect(gapMeetsMargin(G, AV, 4, 0.8e-3, false, 1, m, hint), `hint ${hint}`).toBe(true);
      expect(gapMeetsMargin(G, AV, 4, 0.8e-3, false, 1, m * (1 + 1e-12), hint), `hint ${hint}`).toBe(false);
    }
  });
  it('a margin the hinted point meets but another does not is not met', () => {
    // At 0.8 mm point 1 reads 1.33, point 3 reads 1.13: margin 1.2 fails at 3 whatever the hint.
    expect(gapMeetsMargin(G, AV, 4, 0.8e-3, false, 1, 1.2, 1)).toBe(false);
    expect(gapMeetsMargin(G, AV, 4, 0.8e-3, false, 1, 1.2, 0)).toBe(false);
  });
  it('a hint past the last point read is ignored', () => {
    // lastIndex 2: points 0..2 read >= 1.16 at 0.8 mm; point 3 (1.13) lies past them.
    expect(worst(0.8e-3, 2)).toBeGreaterThan(1.15);
    expect(gapMeetsMargin(G, AV, 2, 0.8e-3, false, 1, 1.15, 3)).toBe(true);
    expect(gapMeetsMargin(G, AV, 2, 0.8e-3, false, 1, 1.15, 4)).toBe(true);
  });
  it('under Paschen\'s law and a reversed coil', () => {
    const m = Math.min(...ratios(0.7e-3, paschenV, 1 / 0.9));
    expect(gapMeetsMargin(G, AV, 4, 0.7e-3, true, 1 / 0.9, m, 3)).toBe(true);
    expect(gapMeetsMargin(G, AV, 4, 0.7e-3, true, 1 / 0.9, m * (1 + 1e-12), 3)).toBe(false);
  });
});

describe('the suggested gap: the largest meeting the margin, rounded down to 0.01 mm', () => {
  const MARGIN = 1.2;
  // The air law solved by hand at each point; the smallest edge sets the gap.
  const edges = DF.map((d, i) => airEdgeM(d, AV[i]!, MARGIN, 1));
  const expected = Math.floor(Math.min(...edges) * 1e5) / 1e5;
  const range = plug(0.5e-3, 1.1e-3);

  it('the hand-solved edge is the one the law sets (checked by substituting)', () => {
    expect(Math.min(...edges)).toBe(edges[3]);
    // About 0.7465 mm, so 0.74 mm; it meets the margin, 0.01 mm more does not.
    expect(Math.min(...edges)).toBeCloseTo(0.7465e-3, 7);
    expect(expected).toBeCloseTo(0.74e-3, 12);
    expect(Math.min(...ratios(expected, airV, 1))).toBeGreaterThanOrEqual(MARGIN);
    expect(Math.min(...ratios(expected + 1e-5, airV, 1))).toBeLessThan(MARGIN);
  });
  for (const hint of [3, 1, 0, 2, 4, -1, 9]) {
    it(`finds it with the worst point hinted as ${hint} (the halving when the hint misleads)`, () => {
      const s = suggestGap(G, AV, 4, range, MARGIN, false, 1, hint);
      expect(s.suggestedGapM).toBeCloseTo(expected, 12);
      expect(s).toMatchObject({ searchedFromM: 0.5e-3, searchedToM: 1.1e-3, marginRatio: MARGIN });
    });
  }
  it('with a reversed coil the edge moves in (the law solved with 1/0.9)', () => {
    const e = Math.floor(Math.min(...DF.map((d, i) => airEdgeM(d, AV[i]!, MARGIN, 1 / 0.9))) * 1e5) / 1e5;
    expect(e).toBeLessThan(expected);
    expect(suggestGap(G, AV, 4, range, MARGIN, false, 1 / 0.9, 3).suggestedGapM).toBeCloseTo(e, 12);
    expect(suggestGap(G, AV, 4, range, MARGIN, false, 1 / 0.9, 1).suggestedGapM).toBeCloseTo(e, 12);
  });
  it('under Paschen\'s law, the edge found by a bisection here', () => {
    const meets = (g: number): boolean => Math.min(...ratios(g, paschenV, 1)) >= MARGIN;
    let a = 0.5e-3;
    let b = 1.1e-3;
    expect(meets(a)).toBe(true);
    expect(meets(b)).toBe(false);
    for (let k = 0; k < 200; k++) {
      const mid = 0.5 * (a + b);
      if (meets(mid)) a = mid;
      else b = mid;
    }
    const e = Math.floor(a * 1e5) / 1e5;
    // Paschen reads higher, so its edge lies below the empirical law's.
    expect(e).toBeLessThan(expected);
    expect(e).toBeGreaterThan(0.5e-3);
    for (const hint of [3, 0, -1]) expect(suggestGap(G, AV, 4, range, MARGIN, true, 1, hint).suggestedGapM, `hint ${hint}`).toBeCloseTo(e, 12);
  });
  it('none when the smallest gap already falls short; the largest when it still meets', () => {
    // 0.5 mm reads 1.71 at the worst point, 1.1 mm reads 0.85.
    expect(suggestGap(G, AV, 4, range, 1.8, false, 1, 3).suggestedGapM).toBeNull();
    expect(suggestGap(G, AV, 4, range, 0.8, false, 1, 3).suggestedGapM).toBe(1.1e-3);
  });
  it('an edge just above the plug\'s smallest gap rounds down to no less than that gap', () => {
    // Range 0.7415 .. 1.1 mm: the edge (0.7465 mm) lies inside, and rounds to 0.74 mm, under the
    // range; the answer is the range's low end, which meets.
    const s = suggestGap(G, AV, 4, plug(0.7415e-3, 1.1e-3), MARGIN, false, 1, 3);
    expect(Math.min(...edges)).toBeGreaterThan(0.7415e-3);
    expect(s.suggestedGapM).toBe(0.7415e-3);
    expect(suggestGap(G, AV, 4, plug(0.7415e-3, 1.1e-3), MARGIN, false, 1, 1).suggestedGapM).toBe(0.7415e-3);
  });
  it('without a usable plug range it searches the default 0.3 to 2.0 mm (common practice)', () => {
    expect(DEFAULT_GAP_RANGE_M).toEqual([0.3e-3, 2.0e-3]);
    for (const p of [null, plug(0, 1e-3), plug(1.2e-3, 1.0e-3)]) {
      const s = suggestGap(G, AV, 4, p, MARGIN, false, 1, 3);
      expect(s.searchedFromM).toBe(0.3e-3);
      expect(s.searchedToM).toBe(2.0e-3);
      expect(s.suggestedGapM).toBeCloseTo(expected, 12);
    }
    // A one-gap range that meets is its own answer.
    expect(suggestGap(G, AV, 4, plug(0.6e-3, 0.6e-3), MARGIN, false, 1, 3).suggestedGapM).toBe(0.6e-3);
  });
});

// ---------------------------------------------------------------- the ballast

const rho = ironRho;
/** Ballast resistance at T from its 20 degC (293.15 K) value, resistance in proportion to resistivity. */
const ballastOhm = (cold: number, t: number): number => (cold * rho(t)) / rho(293.15);

/** Integral over [0, t] of (1 - e^(-u/tau))^2 du = t - 2 tau (1 - e^(-t/tau)) + (tau/2)(1 - e^(-2t/tau)). */
const rampSquareIntegral = (t: number, tau: number): number => t - 2 * tau * -Math.expm1(-t / tau) + (tau / 2) * -Math.expm1((-2 * t) / tau);

interface Circuit { cold: number; theta: number; ambK: number; rest: number; drop: number; L: number; supplyV: number; periodS: number; duty: number }

/** Heat into the ballast at T, watts, with a fixed-duty dwell: <i^2> R_b(T), the RL ramp squared over the dwell. */
function powerFixedDuty(c: Circuit, t: number): number {
  const rb = ballastOhm(c.cold, t);
  const r = c.rest + rb;
  const iF = (c.supplyV - c.drop) / r;
  const tau = c.L / r;
  const td = c.duty * c.periodS;
  return ((iF * iF * rampSquareIntegral(td, tau)) / c.periodS) * rb;
}
const excess = (c: Circuit, t: number): number => c.ambK + c.theta * powerFixedDuty(c, t) - t;

/** The stable equilibrium by bisection from the surroundings (g > 0 there, < 0 far above). */
function rootK(c: Circuit): number {
  let a = c.ambK;
  let b = c.ambK + 1500;
  for (let k = 0; k < 200; k++) {
    const m = 0.5 * (a + b);
    if (excess(c, m) > 0) a = m;
    else b = m;
  }
  return 0.5 * (a + b);
}

const dwellOf = (over: Partial<DwellParams>): DwellParams => ({
  mode: DwellMode.FixedDuty, camFraction: 0.6, floatRpm: null, fixedDuty: 0.6, maxDuty: 0.8, holdS: 0.5e-3, limitA: Infinity, ...over,
});
// 800 rpm, four cylinders, four-stroke: 26.67 sparks per second, 37.5 ms period.
const C: Circuit = { cold: 1.5, theta: 15, ambK: 313.15, rest: 1.6, drop: 0.3, L: 5e-3, supplyV: 13.5, periodS: 0.0375, duty: 0.6 };
function running(c: Circuit, dwell: DwellParams = dwellOf({ fixedDuty: c.duty })): RunningBallast {
  const b = new RunningBallast(c.cold, c.theta, c.ambK, c.rest, c.drop, c.L, dwell);
  b.supplyV = c.supplyV;
  b.periodS = c.periodS;
  b.rpm = 800;
  return b;
}

describe('running iron ballast: T = T_amb + theta <i^2> R(T), by substituting the answer back', () => {
  const T = rootK(C);
  it('the hand-worked equilibrium is well above the surroundings and stable', () => {
    expect(T).toBeGreaterThan(C.ambK + 100);
    expect(T).toBeLessThan(C.ambK + 1500);
    // Stable: heating grows more slowly than the temperature there.
    expect(excess(C, T + 1e-3) - excess(C, T - 1e-3)).toBeLessThan(0);
  });
  it('from a good guess and slope, settles on it; the refined answer and slope are left for the next point', () => {
    const b = running(C);
    const t = b.settle(T + 20, -0.5);
    expect(Math.abs(t - T)).toBeLessThan(1e-3);
    expect(Math.abs(b.refinedK - T)).toBeLessThan(1e-6);
    const slope = (excess(C, T + 1e-3) - excess(C, T - 1e-3)) / 2e-3;
    expect(b.slope / slope).toBeCloseTo(1, 2);
  });
  for (const [what, guess, slope] of [
    ['a first guess below the surroundings', C.ambK - 50, -0.5],
    ['a first guess past the search range', C.ambK + 2000, -0.5],
    ['a first guess that is not a number', Number.NaN, -0.5],
    ['a slope that is positive', C.ambK + 100, 0.3],
    ['a slope that is not a number', C.ambK + 100, Number.NaN],
    ['a slope of minus infinity', C.ambK + 100, -Infinity],
  ] as Array<[string, number, number]>) {
    it(`from ${what}, still the equilibrium`, () => {
      const b = running(C);
      const t = b.settle(guess, slope);
      expect(Math.abs(t - T), `${t} K`).toBeLessThan(1e-3);
      // Substituted back: T_amb + theta P(T) - T is nil to the solution's tolerance.
      expect(Math.abs(excess(C, t))).toBeLessThan(1e-3);
    });
  }
  it('a slope so shallow the first step leaves the range falls back to bisection, and reports the slope there', () => {
    const b = running(C);
    const t = b.settle(C.ambK + 1, -1e-12);
    expect(Math.abs(t - T)).toBeLessThan(1e-6);
    expect(b.refinedK).toBe(t);
    // Central difference of g over +-1 mK at the answer, worked here.
    const d = 1e-3;
    const expectedSlope = (excess(C, t + d) - excess(C, t - d)) / (2 * d);
    expect(expectedSlope).toBeLessThan(-0.1);
    expect(b.slope / expectedSlope).toBeCloseTo(1, 6);
    // The circuit left at the answer: Ohm's law with the iron at T.
    expect(b.rOhm).toBeCloseTo(C.rest + ballastOhm(C.cold, t), 9);
    expect(b.finalA).toBeCloseTo((C.supplyV - C.drop) / (C.rest + ballastOhm(C.cold, t)), 9);
  });
  it('without a path to its surroundings\' heat (theta 0) it stays at the surroundings', () => {
    const b = running({ ...C, theta: 0 });
    expect(b.settle(C.ambK + 100, -1)).toBe(C.ambK);
  });
  it('a fresh object starts from slope -1', () => {
    expect(running(C).slope).toBe(-1);
  });
});

describe('running iron ballast with a current-limited module: the RL ramp to the limit, then held', () => {
  const tK = 600;
  const rb = ballastOhm(C.cold, tK);
  const r = C.rest + rb;
  const iF = (C.supplyV - C.drop) / r;
  const tau = C.L / r;

  it('a limit under the final current: reached at -tau ln(1 - I_lim/I_f), dwell that plus the hold', () => {
    const limit = 1.2;
    expect(iF).toBeGreaterThan(limit);
    const b = running(C, dwellOf({ mode: DwellMode.CurrentLimited, limitA: limit }));
    const p = b.powerW(tK);
    const tl = -tau * Math.log(1 - limit / iF);
    const td = Math.min(0.8 * C.periodS, tl + 0.5e-3);
    expect(td).toBe(tl + 0.5e-3);
    expect(b.toLimitS).toBeCloseTo(tl, 12);
    expect(b.dwellS).toBeCloseTo(td, 12);
    expect(b.breakA).toBe(limit);
    expect(b.tauS).toBeCloseTo(tau, 12);
    // Mean square: the ramp to the limit, then the limit held to the end of the dwell.
    const ms = (iF * iF * rampSquareIntegral(tl, tau) + limit * limit * (td - tl)) / C.periodS;
    expect(p / (ms * rb)).toBeCloseTo(1, 9);
  });
  it('a limit over the final current is never reached: the duty cap sets the dwell', () => {
    const limit = 3;
    expect(iF).toBeLessThan(limit);
    // A 10 % duty cap: 3.75 ms of charge, about 5 time constants, so the current is 0.7 % short of I_f.
    const b = running(C, dwellOf({ mode: DwellMode.CurrentLimited, limitA: limit, maxDuty: 0.1 }));
    const p = b.powerW(tK);
    const td = 0.1 * C.periodS;
    expect(1 - Math.exp(-td / tau)).toBeLessThan(0.999);
    expect(b.toLimitS).toBe(Infinity);
    expect(b.dwellS).toBeCloseTo(td, 12);
    expect(b.breakA).toBeCloseTo(iF * (1 - Math.exp(-td / tau)), 12);
    expect(p / ((iF * iF * rampSquareIntegral(td, tau) / C.periodS) * rb)).toBeCloseTo(1, 9);
  });
  it('a fixed duty ignores the limit time: the dwell is the duty of the period', () => {
    const limit = 1.2;
    const b = running(C, dwellOf({ mode: DwellMode.FixedDuty, fixedDuty: 0.3, limitA: limit }));
    b.powerW(tK);
    expect(b.dwellS).toBeCloseTo(0.3 * C.periodS, 12);
    expect(b.toLimitS).toBeCloseTo(-tau * Math.log(1 - limit / iF), 12);
    // Past the limit the break current is the limit.
    expect(b.breakA).toBe(limit);
  });
  it('no inductance: no time to the limit is worked out and the current stands at the final value', () => {
    const b = running({ ...C, L: 0 }, dwellOf({ fixedDuty: 0.5 }));
    const p = b.powerW(tK);
    expect(b.toLimitS).toBe(Infinity);
    expect(b.breakA).toBeCloseTo(iF, 12);
    // i = I_f for the whole dwell: <i^2> = I_f^2 t_d / T.
    expect(p / (iF * iF * 0.5 * rb)).toBeCloseTo(1, 9);
  });
  it('no drive: no current, no heat', () => {
    const b = running({ ...C, supplyV: 0.2 });
    expect(b.powerW(tK)).toBe(0);
    expect(b.breakA).toBe(0);
  });
});

// ---------------------------------------------------------------- the grid

const rising = (a: ArrayLike<number>): boolean => Array.from(a).every((x, i, all) => i === 0 || x > all[i - 1]!);

describe('sweep rpm where rounding or an anchor breaks the order (grid.ts contract)', () => {
  it('an idle at 110 % of redline takes the top point; the points it leaves out of order are re-spaced evenly', () => {
    // Cranking 180, redline 6000, top 6600 = idle. Six points evenly: 180, 1464, 2748, 4032, 5316,
    // 6600 (step 1284). Redline goes to the nearest point it may (index 3, room kept for idle above
    // it), idle to the top: 6000 then 5316 - out of order, so 6000..6600 is re-spaced: 6300.
    const e: EngineSpec = { ...fourCylinder, idleRpm: 6600, redlineRpm: 6000 };
    expect(Array.from(sweepRpm(e, 6))).toEqual([180, 1464, 2748, 6000, 6300, 6600]);
    // Five points: 180, 1785, 3390, 4995, 6600 (step 1605); redline at index 2, idle at 4.
    expect(Array.from(sweepRpm(e, 5))).toEqual([180, 1785, 6000, 6300, 6600]);
    // Seven: 180, 1250, 2320, 3390, 4460, 5530, 6600 (step 1070); redline nearest 5530 -> index
    // 4 is the highest it may take; 6000, 5530, 6600 re-spaced 6000, 6300, 6600.
    expect(Array.from(sweepRpm(e, 7))).toEqual([180, 1250, 2320, 3390, 6000, 6300, 6600]);
    for (const n of [5, 6, 7, 8, 11, 40]) {
      const rpm = sweepRpm(e, n);
      expect(rpm, `n = ${n}`).toHaveLength(n);
      expect(rising(rpm), `n = ${n}`).toBe(true);
      expect(Array.from(rpm)).toContain(6000);
      expect(rpm[0]).toBe(180);
      expect(rpm[n - 1]).toBe(6600);
      for (const x of rpm) expect(Number.isInteger(x), `${x} at n = ${n}`).toBe(true);
    }
  });
  it('a range finer than the finest rounding (1/10000 rpm) keeps its exact even values', () => {
    // Cranking 1 rpm, redline and idle under it: the top is 1 % above cranking, 1.01 rpm. 2000
    // points step 0.01/1999 rpm, under 1e-4: rounding would merge them, so they stay exact.
    const e: EngineSpec = { ...fourCylinder, crankingRpm: 1, idleRpm: 0.5, redlineRpm: 0.5 };
    const n = 2000;
    const rpm = sweepRpm(e, n);
    expect(rpm).toHaveLength(n);
    expect(rpm[0]).toBe(1);
    expect(rpm[n - 1]).toBe(1.01);
    expect(rising(rpm)).toBe(true);
    const step = (1.01 - 1) / (n - 1);
    for (const m of [1, 2, 500, 1000, 1998]) expect(rpm[m]).toBe(1 + step * m);
  });
  it('a range just coarse enough rounds: 0.1 rpm over 11 points on 0.01 rpm', () => {
    // Cranking 10, top 10.1 (1 % above); step 0.01 rpm, rounded to 1/100.
    const e: EngineSpec = { ...fourCylinder, crankingRpm: 10, idleRpm: 5, redlineRpm: 5 };
    const rpm = Array.from(sweepRpm(e, 11));
    expect(rpm).toEqual([10, 10.01, 10.02, 10.03, 10.04, 10.05, 10.06, 10.07, 10.08, 10.09, 10.1]);
  });
  it('a step between 1/10000 and 1/5000 rpm rounds to 1/10000 (the coarsest unit no larger than the step)', () => {
    // Cranking 1, top 1.01 rpm, 68 points: step 0.01/67 = 1.49e-4 rpm.
    const e: EngineSpec = { ...fourCylinder, crankingRpm: 1, idleRpm: 0.5, redlineRpm: 0.5 };
    const rpm = sweepRpm(e, 68);
    const step = 0.01 / 67;
    expect(rising(rpm)).toBe(true);
    for (const m of [1, 2, 3, 33, 66]) expect(rpm[m]).toBe(Math.round((1 + step * m) * 10000) / 10000);
    expect(rpm[67]).toBe(1.01);
  });
  it('the grids index the first running point at or above idle and the last at or below redline', () => {
    // Six points evenly 180, 1464, 2748, 4032, 5316, 6600; idle 800 takes 1464's place, redline 6000 takes 5316's.
    const g = buildGrids(fourCylinder, resolveConditions(fourCylinder), 6);
    expect(Array.from(g.sweep.rpm)).toEqual([180, 800, 2748, 4032, 6000, 6600]);
    expect(g.idleIndex).toBe(1);
    expect(g.redlineIndex).toBe(4);
  });
  it('the grids built on the re-spaced sweep index idle and redline where they lie', () => {
    const e: EngineSpec = { ...fourCylinder, idleRpm: 6600, redlineRpm: 6000 };
    const g = buildGrids(e, resolveConditions(e), 6);
    expect(Array.from(g.sweep.rpm)).toEqual([180, 1464, 2748, 6000, 6300, 6600]);
    // Last point at or below redline: index 3 (6000); first running point at or above idle: 5 (6600).
    expect(g.redlineIndex).toBe(3);
    expect(g.idleIndex).toBe(5);
    expect(Array.from(g.sweep.cranking)).toEqual([1, 0, 0, 0, 0, 0]);
  });
});
