/**
 * Small laws at their edges: the advance curve held flat below its first row, points float above
 * (and only above) the float rpm, the current-limited dwell when the limit time is unknown, and the
 * magneto's break current when it is not turning or has no rating. Written against the
 * mutation-testing survivors (npm run mutate).
 */
import { describe, expect, it } from 'vitest';
import { currentLimitedDwellS, floatedDwellFraction, magnetoBreakCurrentA, sparkAngleDegBtdc } from '../../electron/checker/index.js';

describe('spark angle: static timing plus the advance curve, held flat beyond its ends', () => {
  // A distributor whose weights already give 5 degrees at 800 rpm, 25 at 3000 (invented curve).
  const curve = [
    { rpm: 800, advanceDeg: 5 },
    { rpm: 3000, advanceDeg: 25 },
  ];
  it('below the first row: static + the first row\'s advance', () => {
    expect(sparkAngleDegBtdc(8, curve, 500)).toBe(8 + 5);
    expect(sparkAngleDegBtdc(8, curve, 800)).toBe(8 + 5);
    expect(sparkAngleDegBtdc(10, [{ rpm: 1000, advanceDeg: -3 }], 600)).toBe(10 - 3);
  });
  it('between rows by straight-line interpolation, beyond the last row flat', () => {
    // Halfway from 800 to 3000 rpm (1900 rpm): 5 + (25 - 5) / 2 = 15 degrees of advance.
    expect(sparkAngleDegBtdc(8, curve, 1900)).toBeCloseTo(8 + 15, 12);
    expect(sparkAngleDegBtdc(8, curve, 6000)).toBe(8 + 25);
  });
});

describe('points float (our model: dwell shrinks by (float rpm / rpm)^2 above the float rpm)', () => {
  it('leaves the dwell alone at and below the float rpm', () => {
    expect(floatedDwellFraction(0.6, 3000, 5000)).toBe(0.6);
    expect(floatedDwellFraction(0.6, 800, 5000)).toBe(0.6);
    expect(floatedDwellFraction(0.6, 5000, 5000)).toBe(0.6);
  });
  it('shrinks it above', () => {
    expect(floatedDwellFraction(0.6, 6000, 5000)).toBeCloseTo(0.6 * (5000 / 6000) ** 2, 12);
  });
});

describe('current-limited dwell: time to the limit plus the hold, capped at the maximum duty', () => {
  it('takes the cap when the limit is never reached, or its time is not known', () => {
    // 0.8 x 10 ms = 8 ms.
    expect(currentLimitedDwellS(Infinity, 0.5e-3, 10e-3, 0.8)).toBeCloseTo(8e-3, 15);
    expect(currentLimitedDwellS(Number.NaN, 0.5e-3, 10e-3, 0.8)).toBeCloseTo(8e-3, 15);
  });
  it('otherwise the rise plus the hold, when under the cap', () => {
    expect(currentLimitedDwellS(2e-3, 0.5e-3, 10e-3, 0.8)).toBeCloseTo(2.5e-3, 15);
  });
});

describe('magneto break current (our model: i ~ x / sqrt(1 + x^2), rated at x = 3 at the full-output rpm)', () => {
  it('gives nothing when the armature does not turn (no motion, no EMF: Faraday\'s law)', () => {
    expect(magnetoBreakCurrentA(0, 3, 2000)).toBe(0);
    expect(magnetoBreakCurrentA(-500, 3, 2000)).toBe(0);
    expect(magnetoBreakCurrentA(Number.NaN, 3, 2000)).toBe(0);
  });
  it('gives nothing without a rating or a full-output speed', () => {
    expect(magnetoBreakCurrentA(1000, 0, 2000)).toBe(0);
    expect(magnetoBreakCurrentA(1000, -3, 2000)).toBe(0);
    expect(magnetoBreakCurrentA(1000, 3, 0)).toBe(0);
  });
  it('gives the rating at the full-output speed and follows the law between', () => {
    const shape = (x: number) => x / Math.sqrt(1 + x * x);
    expect(magnetoBreakCurrentA(2000, 3, 2000)).toBeCloseTo(3, 12);
    // Cranking at 200 rpm: x = 3 x 200 / 2000 = 0.3.
    expect(magnetoBreakCurrentA(200, 3, 2000)).toBeCloseTo((3 * shape(0.3)) / shape(3), 12);
  });
});
