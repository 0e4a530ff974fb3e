/**
 * The plug-gap search's parts, each against what it claims (gap.ts):
 * - `airLawEdgeGapM` solves the empirical air breakdown law V_kV = 24.22 x + 6.08 sqrt(x)
 *   (breakdown.ts; x the density-reduced gap in cm) for the gap where available / (required x
 *   polarity) equals the margin: checked by substituting the answer back into the law, worked here.
 * - `largestMeetingGapM` is a bisection over whole 0.01 mm steps (Burden & Faires, Numerical
 *   Analysis, section 2.1: each evaluation halves the bracket, so a bracket of N steps needs
 *   ceil(log2 N) evaluations). It is given a plain threshold predicate written here (g <= E), so the
 *   answer is floor(E / 0.01 mm) x 0.01 mm by arithmetic, and the number of evaluations is counted
 *   (an argument the test passes, not a stand-in for product code).
 * - `gapMeetsMargin` must answer as the full scan "worst ratio >= margin" whatever point it starts
 *   at: each point read once, every point read when all meet.
 */
import { describe, expect, it } from 'vitest';
import { airLawEdgeGapM, gapMeetsMargin, largestMeetingGapM, suggestGap } from '../../electron/checker/gap.js';
import { airV, gridOf } from './worked-laws.js';


describe('the edge gap one point sets under the empirical air law', () => {
  const cases = [
    // density factor, available V, margin, polarity factor
    [1, 30_300, 1, 1],
    [9, 30_000, 1.2, 1],
    [12, 34_000, 1.25, 1 / 0.9],
    [0.8, 12_000, 1.5, 1],
    [4.5, 25_000, 2, 1 / 0.9],
  ] as const;
  for (const [df, av, margin, pol] of cases) {
    it(`density ${df}, ${av} V, margin ${margin}, polarity ${pol.toFixed(3)}: the law at the answer gives available / (margin x polarity)`, () => {
      const gapM = airLawEdgeGapM(df, av, margin, pol);
      expect(gapM).toBeGreaterThan(0);
      const required = airV(gapM * 100 * df) * pol;
      expect(av / required).toBeCloseTo(margin, 9);
    });
  }
  it('1 cm at one atmosphere is about 30.3 kV (breakdown.ts; about 30 kV published): the edge at 30.3 kV, margin 1, is 1 cm', () => {
    // 24.22 + 6.08 = 30.30 kV at x = 1 exactly.
    expect(airLawEdgeGapM(1, 30_300, 1, 1)).toBeCloseTo(0.01, 12);
    // Twice the density halves the gap for the same reduced gap.
    expect(airLawEdgeGapM(2, 30_300, 1, 1)).toBeCloseTo(0.005, 12);
  });
  it('a larger margin or a reversed coil moves the edge in; more voltage moves it out', () => {
    const base = airLawEdgeGapM(9, 30_000, 1.2, 1);
    expect(airLawEdgeGapM(9, 30_000, 1.5, 1)).toBeLessThan(base);
    expect(airLawEdgeGapM(9, 30_000, 1.2, 1 / 0.9)).toBeLessThan(base);
    expect(airLawEdgeGapM(9, 33_000, 1.2, 1)).toBeGreaterThan(base);
  });
  it('has no answer without density or voltage (NaN)', () => {
    expect(airLawEdgeGapM(0, 30_000, 1.2, 1)).toBeNaN();
    expect(airLawEdgeGapM(-1, 30_000, 1.2, 1)).toBeNaN();
    // No voltage: sqrt(x) = 0 is the only root, not a positive gap.
    expect(airLawEdgeGapM(9, 0, 1.2, 1)).toBeNaN();
    expect(airLawEdgeGapM(9, -5000, 1.2, 1)).toBeNaN();
  });
});

describe('the largest whole 0.01 mm step that meets, by bisection', () => {
  /** A predicate true up to E (metres), counting its calls. */
  function threshold(edgeM: number): { meets: (g: number) => boolean; calls: number[] } {
    const calls: number[] = [];
    return { calls, meets: (g: number) => { calls.push(g); return g <= edgeM; } };
  }
  const LO = 0.3e-3;
  const HI = 2.0e-3; // 170 steps of 0.01 mm from 0.30 to 2.00 mm

  for (const edge of [0.74651e-3, 0.30001e-3, 1.99999e-3, 0.81e-3, 1.234567e-3]) {
    it(`edge ${(edge * 1e3).toFixed(5)} mm: floor to 0.01 mm, within ceil(log2 170) = 8 calls without a guess`, () => {
      const expected = Math.floor(edge * 1e5) / 1e5;
      const t = threshold(edge);
      expect(largestMeetingGapM(LO, HI, t.meets, Number.NaN)).toBe(expected);
      expect(t.calls.length).toBeLessThanOrEqual(Math.ceil(Math.log2(170)));
      // Every gap tried is a whole step inside the range.
      for (const g of t.calls) {
        expect(g).toBeGreaterThanOrEqual(LO);
        expect(g).toBeLessThan(HI);
        expect(Math.abs(g * 1e5 - Math.round(g * 1e5))).toBeLessThan(1e-6);
      }
    });
  }
  it('an exact guess decides in two calls: the guess meets, the step above does not', () => {
    const edge = 0.74651e-3;
    const t = threshold(edge);
    expect(largestMeetingGapM(LO, HI, t.meets, edge)).toBe(0.74e-3);
    expect(t.calls).toEqual([0.74e-3, 0.75e-3]);
  });
  it('a guess above the answer costs one call and the bisection finishes in the narrower range', () => {
    const t = threshold(0.74651e-3);
    expect(largestMeetingGapM(LO, HI, t.meets, 1.5e-3)).toBe(0.74e-3);
    expect(t.calls[0]).toBe(1.5e-3);
    // The rest search 0.30 .. 1.50 mm: 120 steps, ceil(log2 120) = 7.
    expect(t.calls.length).toBeLessThanOrEqual(1 + 7);
    expect(t.calls.slice(1).every((g) => g < 1.5e-3)).toBe(true);
  });
  it('a guess below the answer costs two calls and the search goes on above it', () => {
    const t = threshold(0.74651e-3);
    expect(largestMeetingGapM(LO, HI, t.meets, 0.5e-3)).toBe(0.74e-3);
    expect(t.calls.slice(0, 2)).toEqual([0.5e-3, 0.51e-3]);
    expect(t.calls.slice(2).every((g) => g > 0.51e-3)).toBe(true);
    // 0.51 .. 2.00 mm: 149 steps, ceil(log2 149) = 8.
    expect(t.calls.length).toBeLessThanOrEqual(2 + 8);
  });
  it('a guess outside the range, or not a number, is not tried', () => {
    for (const guess of [0.1e-3, 0.29e-3, 2.0e-3, 2.5e-3, Number.NaN, Infinity, -Infinity]) {
      const t = threshold(0.74651e-3);
      expect(largestMeetingGapM(LO, HI, t.meets, guess), `guess ${guess}`).toBe(0.74e-3);
      expect(t.calls.every((g) => g >= LO && g < HI), `guess ${guess}`).toBe(true);
      expect(t.calls.length, `guess ${guess}`).toBeLessThanOrEqual(8);
    }
  });
  it('a guess on the last step meeting, just under hi, needs no call above it', () => {
    // Range 0.30 .. 0.80 mm, edge 0.7999 mm: the answer 0.79 mm is the last step below hi.
    const t = threshold(0.7999e-3);
    expect(largestMeetingGapM(LO, 0.8e-3, t.meets, 0.7999e-3)).toBe(0.79e-3);
    expect(t.calls).toEqual([0.79e-3]);
  });
  it('the range\'s low end itself when no whole step in it meets (the edge lies below the first step)', () => {
    // lo 0.7415 mm meets (the caller checked), the first whole step 0.75 mm does not.
    const t = threshold(0.7465e-3);
    expect(largestMeetingGapM(0.7415e-3, 1.1e-3, t.meets, Number.NaN)).toBe(0.7415e-3);
    // Steps 0.75 .. 1.09 mm: 35 candidates, so ceil(log2 36) = 6 calls, 0.75 mm among them.
    expect(t.calls).toContain(0.75e-3);
    expect(t.calls.length).toBeLessThanOrEqual(6);
    // A range within one step: nothing to try.
    const u = threshold(0.7465e-3);
    expect(largestMeetingGapM(0.7415e-3, 0.7465e-3, u.meets, 0.7415e-3)).toBe(0.7415e-3);
    expect(u.calls).toEqual([]);
  });
  it('the first whole step above a low end that is not on a step, when it meets and the next does not', () => {
    // lo 0.7415 mm, edge 0.7551 mm: 0.75 mm meets, 0.76 mm does not; the answer is 0.75 mm, not lo.
    const t = threshold(0.7551e-3);
    expect(largestMeetingGapM(0.7415e-3, 1.1e-3, t.meets, Number.NaN)).toBe(0.75e-3);
    const u = threshold(0.7551e-3);
    expect(largestMeetingGapM(0.7415e-3, 1.1e-3, u.meets, 0.7551e-3)).toBe(0.75e-3);
  });
  it('a low end on a whole step counts as a step', () => {
    const t = threshold(0.30999e-3);
    expect(largestMeetingGapM(LO, HI, t.meets, Number.NaN)).toBe(0.3e-3);
    const u = threshold(0.31e-3);
    expect(largestMeetingGapM(LO, HI, u.meets, Number.NaN)).toBe(0.31e-3);
  });
});

describe('whether a gap meets the margin: each point read once, from the hinted one round', () => {
  const DF = [2, 3, 4, 5, 6];
  const G = gridOf({ densityFactor: DF });
  const GAP = 0.8e-3;
  /** Available voltage that gives `ratio` at point i for the 0.8 mm gap, by the law. */
  const availableFor = (ratios: readonly number[]): Float64Array => Float64Array.from(ratios.map((r, i) => r * airV(GAP * 100 * DF[i]!)));

  it('a single short point anywhere is found from every starting point, including the last and the first', () => {
    for (let bad = 0; bad < 5; bad++) {
      const ratios = [1.5, 1.5, 1.5, 1.5, 1.5];
      ratios[bad] = 1.1;
      const av = availableFor(ratios);
      for (const hint of [-1, 0, 1, 2, 3, 4, 5, 9]) {
        expect(gapMeetsMargin(G, av, 4, GAP, false, 1, 1.2, hint), `short at ${bad}, hint ${hint}`).toBe(false);
      }
    }
  });
  it('all meeting: true from every starting point (the worst ratio, 1.3, is over 1.2)', () => {
    const av = availableFor([1.5, 1.3, 1.6, 1.4, 1.5]);
    for (const hint of [-1, 0, 1, 2, 3, 4, 5]) expect(gapMeetsMargin(G, av, 4, GAP, false, 1, 1.2, hint), `hint ${hint}`).toBe(true);
  });
  it('points after lastIndex do not count, from any start', () => {
    const av = availableFor([1.5, 1.5, 1.5, 1.5, 1.1]);
    for (const hint of [0, 2, 3, 4]) expect(gapMeetsMargin(G, av, 3, GAP, false, 1, 1.2, hint), `hint ${hint}`).toBe(true);
  });
  it('no finite ratio reads as 0 (as the full scan does), which no positive margin meets', () => {
    // No points at all.
    expect(gapMeetsMargin(G, availableFor([1.5, 1.5, 1.5, 1.5, 1.5]), -1, GAP, false, 1, 1.2, 0)).toBe(false);
    // Unbounded available voltage everywhere: every ratio is Infinity.
    const inf = Float64Array.from([Infinity, Infinity, Infinity, Infinity, Infinity]);
    expect(gapMeetsMargin(G, inf, 4, GAP, false, 1, 1.2, 2)).toBe(false);
    // One finite point among them is enough.
    const one = Float64Array.from([Infinity, Infinity, 1.5 * airV(GAP * 100 * 4), Infinity, Infinity]);
    expect(gapMeetsMargin(G, one, 4, GAP, false, 1, 1.2, 0)).toBe(true);
    // A NaN point is skipped, as the full scan's comparison skips it.
    const nan = Float64Array.from([Number.NaN, ...availableFor([1.5, 1.5, 1.5, 1.5]).slice(0, 4)]);
    expect(gapMeetsMargin(gridOf({ densityFactor: [2, 2, 3, 4, 5] }), nan, 4, GAP, false, 1, 1.2, 0)).toBe(true);
  });
  it('a margin not positive (or not a number) is judged by the full scan: NaN never met', () => {
    const av = availableFor([1.5, 1.3, 1.6, 1.4, 1.5]);
    expect(gapMeetsMargin(G, av, 4, GAP, false, 1, Number.NaN, 2)).toBe(false);
    expect(gapMeetsMargin(G, av, 4, GAP, false, 1, 0, 2)).toBe(true);
  });
  it('the whole search on this grid lands on the law\'s edge at the worst point (1.1 at point 3)', () => {
    // At 0.8 mm the ratios are as given; the edge is where point 3's ratio falls to 1.0.
    const av = availableFor([1.5, 1.3, 1.6, 1.1, 1.5]);
    // Each point's edge by a bisection on the law here (200 halvings of 0.1 .. 5 mm).
    const edges = DF.map((d, i) => {
      let a = 0.1e-3;
      let b = 5e-3;
      for (let k = 0; k < 200; k++) {
        const mid = 0.5 * (a + b);
        if (av[i]! / airV(mid * 100 * d) >= 1) a = mid;
        else b = mid;
      }
      return a;
    });
    const e = Math.min(...edges);
    expect(edges.indexOf(e)).toBe(3);
    const s = suggestGap(G, av, 4, null, 1, false, 1, 0);
    expect(s.suggestedGapM).toBe(Math.floor(e * 1e5) / 1e5);
  });
});
