/**
 * Where the sweep starts each running point's ballast solution (sweep.ts): the answers at the points
 * before it carried on to this rpm. The parabola through three points, in Lagrange's form
 * L_j(x) = prod_{m != j} (x - x_m) / (x_j - x_m) (Burden & Faires, Numerical Analysis, sec. 3.1),
 * reproduces any quadratic exactly, and the line through two reproduces any straight line; both
 * facts are used here with quadratics and lines chosen in the test, so every expected value is
 * the chosen function at the new rpm. Written against the mutation-testing survivors.
 */
import { describe, expect, it } from 'vitest';
import { carriedStartK, carryWeightsOf } from '../../electron/checker/sweep.js';
import { gridOf as handGrid } from './worked-laws.js';

/** A hand-made grid with uneven rpm steps: carryWeightsOf reads only `n` and `rpm`. */
const gridOf = (rpm: readonly number[]) => handGrid({ rpm });

const RPM = [180, 800, 1500, 2700, 4000, 5300, 6000, 6600];
// A new grid object in each test: the weights are remembered per grid object (a WeakMap), and a
// grid kept between tests would hand a later test the weights an earlier one worked out.
/** A smooth, curved temperature against rpm (any quadratic will do). */
const quad = (x: number): number => 400 + 0.09 * x - 6e-6 * x * x;
const line = (x: number): number => 350 + 0.05 * x;

describe('the carry weights: the Lagrange basis of the three points before each point', () => {
  it('has three per point, zero for the first three (no three points before them)', () => {
    const w = carryWeightsOf(gridOf(RPM));
    expect(w.length).toBe(3 * RPM.length);
    for (let k = 0; k < 9; k++) expect(w[k]).toBe(0);
  });
  for (let i = 3; i < RPM.length; i++) {
    it(`at point ${i} (${RPM[i]} rpm) each weight is L_j(x_0) worked here, and they carry a quadratic exactly`, () => {
      const w = carryWeightsOf(gridOf(RPM));
      const [x0, x1, x2, x3] = [RPM[i]!, RPM[i - 1]!, RPM[i - 2]!, RPM[i - 3]!];
      const L1 = ((x0 - x2) * (x0 - x3)) / ((x1 - x2) * (x1 - x3));
      const L2 = ((x0 - x1) * (x0 - x3)) / ((x2 - x1) * (x2 - x3));
      const L3 = ((x0 - x1) * (x0 - x2)) / ((x3 - x1) * (x3 - x2));
      expect(w[3 * i]).toBeCloseTo(L1, 12);
      expect(w[3 * i + 1]).toBeCloseTo(L2, 12);
      expect(w[3 * i + 2]).toBeCloseTo(L3, 12);
      // The basis sums to 1 (a constant is carried unchanged).
      expect(w[3 * i]! + w[3 * i + 1]! + w[3 * i + 2]!).toBeCloseTo(1, 12);
      expect(w[3 * i]! * quad(x1) + w[3 * i + 1]! * quad(x2) + w[3 * i + 2]! * quad(x3)).toBeCloseTo(quad(x0), 9);
    });
  }
  it('is worked out once per grid (the same array the next time)', () => {
    const g = gridOf(RPM);
    const w = carryWeightsOf(g);
    expect(carryWeightsOf(g)).toBe(w);
    expect(carryWeightsOf(gridOf(RPM))).not.toBe(w);
  });
});

describe('the start of each point\'s solution', () => {
  // Weights worked here by Lagrange's form (not by the code under test), for the grid above.
  const w = new Float64Array(3 * RPM.length);
  for (let i = 3; i < RPM.length; i++) {
    const [x0, x1, x2, x3] = [RPM[i]!, RPM[i - 1]!, RPM[i - 2]!, RPM[i - 3]!];
    w[3 * i] = ((x0 - x2) * (x0 - x3)) / ((x1 - x2) * (x1 - x3));
    w[3 * i + 1] = ((x0 - x1) * (x0 - x3)) / ((x2 - x1) * (x2 - x3));
    w[3 * i + 2] = ((x0 - x1) * (x0 - x2)) / ((x3 - x1) * (x3 - x2));
  }
  const NaN_ = Number.NaN;
  it('before any answer: the hot idle value given', () => {
    expect(carriedStartK(w, 5, NaN_, NaN_, NaN_, false, 5300, 4000, 2700, 612.5)).toBe(612.5);
    expect(carriedStartK(w, 5, NaN_, 500, 480, true, 5300, 4000, 2700, 612.5)).toBe(612.5);
  });
  it('after one answer: that answer', () => {
    expect(carriedStartK(w, 2, 555, NaN_, NaN_, true, 1500, 800, NaN_, 612.5)).toBe(555);
    expect(carriedStartK(w, 2, 555, NaN_, 470, true, 1500, 800, NaN_, 612.5)).toBe(555);
  });
  it('after two, or three not just before this point: the line through the last two, exact for a straight line', () => {
    // Points 1 and 2 solved, now point 3.
    expect(carriedStartK(w, 3, line(1500), line(800), NaN_, true, 2700, 1500, 800, 612.5)).toBeCloseTo(line(2700), 9);
    // Three answers, but a point was skipped since (not consecutive): the line, not the parabola.
    const k = carriedStartK(w, 6, quad(4000), quad(2700), quad(1500), false, 6000, 4000, 2700, 612.5);
    const byLine = quad(4000) + ((quad(4000) - quad(2700)) * (6000 - 4000)) / (4000 - 2700);
    expect(k).toBeCloseTo(byLine, 9);
    expect(Math.abs(k - quad(6000))).toBeGreaterThan(1);
  });
  for (let i = 3; i < RPM.length; i++) {
    it(`after three just before point ${i}: the parabola through them, exact for a quadratic`, () => {
      const k = carriedStartK(w, i, quad(RPM[i - 1]!), quad(RPM[i - 2]!), quad(RPM[i - 3]!), true, RPM[i]!, RPM[i - 1]!, RPM[i - 2]!, 612.5);
      expect(k).toBeCloseTo(quad(RPM[i]!), 9);
      // ... where the line through the last two misses the curve.
      const byLine = quad(RPM[i - 1]!) + ((quad(RPM[i - 1]!) - quad(RPM[i - 2]!)) * (RPM[i]! - RPM[i - 1]!)) / (RPM[i - 1]! - RPM[i - 2]!);
      expect(Math.abs(byLine - quad(RPM[i]!))).toBeGreaterThan(0.1);
    });
  }
});
