/**
 * The charts' axis and scale arithmetic (renderer/charts/scale.ts), checked against the nice-number
 * rule it follows (P. S. Heckbert, "Nice Numbers for Graph Labels", Graphics Gems, 1990: steps of
 * 1, 2 or 5 times a power of ten; rounding thresholds 1.5, 3 and 7) and against brute force.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bandPath, linearScale, linePath, markerIndices, maxOf, nearestIndex, niceNumber, niceTicks, tickDecimals } from '../../renderer/charts/scale.js';

describe('nice numbers (Heckbert 1990)', () => {
  it.each([
    [1.4, 1],
    [1.6, 2],
    [2.9, 2],
    [3.1, 5],
    [6.9, 5],
    [7.1, 10],
    [0.034, 0.05],
    [1100, 1000],
    [20.2, 20],
  ])('rounds %f to %f', (x, nice) => {
    expect(niceNumber(x, true)).toBeCloseTo(nice, 12);
  });

  it.each([
    [1, 1],
    [1.01, 2],
    [2, 2],
    [2.1, 5],
    [5.1, 10],
    [0.0021, 0.005],
  ])('takes %f up to %f when not rounding', (x, nice) => {
    expect(niceNumber(x, false)).toBeCloseTo(nice, 12);
  });

  it('always gives 1, 2 or 5 times a power of ten', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e9, noNaN: true }), fc.boolean(), (x, round) => {
        const n = niceNumber(x, round);
        const mantissa = n / 10 ** Math.floor(Math.log10(n) + 1e-12);
        return [1, 2, 5].some((m) => Math.abs(mantissa - m) < 1e-9);
      }),
      { numRuns: 10_000 },
    );
  });
});

describe('ticks', () => {
  it('covers an engine sweep of 180 to 6600 rpm in steps of 1000', () => {
    const t = niceTicks(180, 6600, 7);
    expect(t.step).toBe(1000);
    expect(t.values).toEqual([0, 1000, 2000, 3000, 4000, 5000, 6000, 7000]);
  });

  it('gives 0 to 120 mJ in 20s for energies up to 101 mJ', () => {
    expect(niceTicks(0, 101, 6)).toMatchObject({ min: 0, max: 120, step: 20 });
  });

  it('covers the data with whole steps, for any interval', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: 1e-3, max: 1e6, noNaN: true }), fc.integer({ min: 2, max: 12 }), (lo, span, count) => {
        const t = niceTicks(lo, lo + span, count);
        if (!(t.min <= lo + 1e-9 * Math.abs(lo) && t.max >= lo + span - 1e-9 * Math.abs(lo + span))) return false;
        if (t.values.length < 2 || t.values.length > 4 * count + 2) return false;
        return t.values.every((v, i) => Math.abs(v - (t.min + i * t.step)) <= 1e-9 * Math.max(1, Math.abs(v)));
      }),
      { numRuns: 10_000 },
    );
  });

  it('a flat or reversed interval still gives an axis', () => {
    expect(niceTicks(5, 5).values.length).toBeGreaterThan(1);
    expect(niceTicks(0, 0).values.length).toBeGreaterThan(1);
    expect(niceTicks(10, 0)).toMatchObject({ min: 0, max: 10 });
  });

  it.each([
    [0.5, 1],
    [0.2, 1],
    [0.05, 2],
    [1, 0],
    [20, 0],
    [1000, 0],
  ])('labels a step of %f with %i decimals', (step, d) => {
    expect(tickDecimals(step)).toBe(d);
  });
});

describe('scales and paths', () => {
  it('maps the ends of the domain onto the ends of the range and inverts exactly', () => {
    const s = linearScale(180, 6600, 54, 506);
    expect(s.map(180)).toBe(54);
    expect(s.map(6600)).toBeCloseTo(506, 9);
    fc.assert(
      fc.property(fc.double({ min: -1e5, max: 1e5, noNaN: true }), (v) => Math.abs(s.invert(s.map(v)) - v) <= 1e-7 * Math.max(1, Math.abs(v))),
      { numRuns: 10_000 },
    );
    // An inverted pixel range (SVG y grows downwards).
    const y = linearScale(0, 40, 256, 14);
    expect(y.map(0)).toBe(256);
    expect(y.map(40)).toBeCloseTo(14, 9);
  });

  it('finds the nearest x the same way a linear search does', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.integer({ min: 0, max: 10_000 }), { minLength: 1, maxLength: 60 }), fc.double({ min: -100, max: 10_100, noNaN: true }), (raw, x) => {
        const xs = [...raw].sort((a, b) => a - b);
        const i = nearestIndex(xs, x);
        const best = Math.min(...xs.map((v) => Math.abs(v - x)));
        return Math.abs(xs[i]! - x) === best;
      }),
      { numRuns: 10_000 },
    );
    expect(nearestIndex([], 3)).toBe(-1);
  });

  it('draws a line through every finite point, breaking at a missing one', () => {
    const sx = linearScale(0, 10, 0, 100);
    const sy = linearScale(0, 10, 100, 0);
    expect(linePath([0, 5, 10], [0, 5, 10], sx, sy)).toBe('M0.0 100.0L50.0 50.0L100.0 0.0');
    expect(linePath([0, 2, 4, 6], [1, Number.NaN, 3, 4], sx, sy)).toBe('M0.0 90.0M40.0 70.0L60.0 60.0');
    expect(linePath([0, 5, 10], [0, 5, 10], sx, sy, 1)).toBe('M50.0 50.0L100.0 0.0');
  });

  it('closes a band along the upper edge and back along the lower one', () => {
    const sx = linearScale(0, 2, 0, 20);
    const sy = linearScale(0, 10, 10, 0);
    expect(bandPath([0, 1, 2], [1, 2, 3], [2, 3, 4], sx, sy)).toBe('M0.0 8.0L10.0 7.0L20.0 6.0L20.0 7.0L10.0 8.0L0.0 9.0Z');
    expect(bandPath([0], [1], [2], sx, sy)).toBe('');
  });

  it('takes the largest finite value and spreads markers evenly', () => {
    expect(maxOf([[1, 5, Number.NaN], [Number.POSITIVE_INFINITY, 3]])).toBe(5);
    expect(maxOf([[]])).toBe(0);
    expect(markerIndices(100, 8, 1)).toEqual([1, 13, 25, 37, 49, 61, 73, 85, 97]);
  });
});
