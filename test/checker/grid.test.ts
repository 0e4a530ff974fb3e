/**
 * The sweep's rpm points (electron/checker/grid.ts): cranking first, the speeds the person entered
 * (idle, redline) exactly, round values elsewhere (no 6600.000000000001), exactly the number of
 * points asked for, rising, and reaching 110 % of redline. Expected values are worked by hand
 * from the engine's entered speeds.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkSetup, compareSetups } from '../../electron/checker/index.js';
import { forgetLastGrids, gridsFor, MAX_RPM_POINTS, MIN_RPM_POINTS, rpmPointCount, sweepRpm } from '../../electron/checker/grid.js';
import { resolveConditions } from '../../electron/checker/conditions.js';
import type { EngineSpec } from '../../electron/checker/types.js';
import { fourCylinder, moduleSetup, module, pointsSetup } from './fixtures.js';

const rising = (a: readonly number[]): boolean => a.every((x, i) => i === 0 || x > a[i - 1]!);

describe('the sweep grid', () => {
  it('runs from cranking to 110 % of redline on whole rpm, with idle and redline exactly, at the count asked', () => {
    // fourCylinder: cranking 180, idle 800, redline 6000 rpm. 110 % of 6000 is 6600 rpm.
    for (const n of [5, 12, 40, 60, 199, 200, 1000, 2000]) {
      const r = checkSetup(fourCylinder, pointsSetup(), undefined, { rpmPoints: n, skipGapSuggestion: true });
      const rpm = r.points.map((p) => p.rpm);
      expect(rpm, `n = ${n}`).toHaveLength(n);
      expect(rpm[0]).toBe(180);
      expect(rpm.at(-1)).toBe(6600);
      expect(rpm).toContain(800);
      expect(rpm).toContain(6000);
      expect(rising(rpm), `n = ${n} rises`).toBe(true);
      for (const x of rpm) expect(Number.isInteger(x), `${x} rpm at n = ${n}`).toBe(true);
      // Evenly spread: the nominal step is (6600 - 180)/(n - 1); moving idle and redline onto
      // their nearest points and rounding leaves every step within half a step of it (one rpm of
      // rounding allowed on top), once idle lies more than half a step above cranking (at n = 5
      // the step is 1605 rpm and idle, 620 rpm above cranking, takes the point at 1785).
      const step = (6600 - 180) / (n - 1);
      for (let i = 1; i < n && step / 2 < 800 - 180; i++) {
        const gap = rpm[i]! - rpm[i - 1]!;
        expect(gap, `step ${i} at n = ${n}`).toBeGreaterThanOrEqual(step / 2 - 1);
        expect(gap, `step ${i} at n = ${n}`).toBeLessThanOrEqual(1.5 * step + 1);
      }
      // Only the first point is on the cranking supply.
      expect(r.points.map((p) => p.supplyCase === 'cranking')).toEqual(rpm.map((_, i) => i === 0));
    }
  });

  it('keeps speeds entered with a fraction exactly and rounds the rest to whole rpm', () => {
    const odd: EngineSpec = { ...fourCylinder, crankingRpm: 172.5, idleRpm: 762.5, redlineRpm: 5850.5 };
    const rpm = Array.from(sweepRpm(odd, 100));
    expect(rpm[0]).toBe(172.5);
    expect(rpm).toContain(762.5);
    expect(rpm).toContain(5850.5);
    // 110 % of 5850.5 is 6435.55 rpm: the top rounds to 6436.
    expect(rpm.at(-1)).toBe(6436);
    const entered = new Set([172.5, 762.5, 5850.5]);
    for (const x of rpm) if (!entered.has(x)) expect(Number.isInteger(x), `${x}`).toBe(true);
  });

  it('with the fewest points a check takes, still holds cranking, the entered idle and redline', () => {
    // 3 points (the least a check asks for): cranking, idle, redline; 4: and 110 % of redline.
    expect(Array.from(sweepRpm(fourCylinder, 3))).toEqual([180, 800, 6000]);
    expect(Array.from(sweepRpm(fourCylinder, 4))).toEqual([180, 800, 6000, 6600]);
    // A check asked for fewer is held at 3, so its sweep never loses the idle.
    for (const asked of [1, 2]) {
      const r = checkSetup(fourCylinder, pointsSetup(), undefined, { rpmPoints: asked, skipGapSuggestion: true });
      expect(r.points.map((p) => p.rpm), `${asked} asked`).toEqual([180, 800, 6000]);
    }
  });

  it('points the report’s idle and redline rows and its worst-point speeds at entered or round values', () => {
    const c = compareSetups({ engine: fourCylinder, existing: pointsSetup(), candidates: [moduleSetup(module())], options: { rpmPoints: 60 } });
    for (const s of [c.existing, ...c.candidates]) {
      const at = (rpm: number) => s.points.find((p) => p.rpm === rpm);
      expect(at(800), 'idle is a sweep point').toBeDefined();
      expect(at(6000), 'redline is a sweep point').toBeDefined();
      expect(Number.isInteger(s.worstReserveRpm), `worst reserve at ${s.worstReserveRpm}`).toBe(true);
    }
  });

  it('takes 3 to 2000 points and holds a request outside that to the nearest end', () => {
    expect([MIN_RPM_POINTS, MAX_RPM_POINTS]).toEqual([3, 2000]);
    expect(rpmPointCount(1)).toBe(3);
    expect(rpmPointCount(2)).toBe(3);
    expect(rpmPointCount(5000)).toBe(2000);
    expect(rpmPointCount(60.7)).toBe(60);
    expect(rpmPointCount(Number.NaN)).toBe(200);
  });

  it('on any engine and any count: the count asked, rising, cranking first, idle and redline exactly (fast-check)', () => {
    const pos = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
    fc.assert(
      fc.property(pos(300, 2000), pos(0.05, 0.95), pos(1.2, 12), fc.integer({ min: MIN_RPM_POINTS, max: MAX_RPM_POINTS }), fc.boolean(), (idle, crankFrac, redFactor, n, whole) => {
        const round = (x: number) => (whole ? Math.round(x) : x);
        const e: EngineSpec = { ...fourCylinder, idleRpm: round(idle), crankingRpm: round(Math.min(1000, idle * crankFrac)), redlineRpm: round(Math.min(20000, idle * redFactor)) };
        if (!(e.crankingRpm < e.idleRpm && e.idleRpm < e.redlineRpm)) return true;
        const rpm = Array.from(sweepRpm(e, n));
        if (rpm.length !== n || !rising(rpm) || rpm[0] !== e.crankingRpm) return false;
        if (!rpm.includes(e.redlineRpm) || !rpm.includes(e.idleRpm)) return false;
        return rpm.every((x) => Number.isFinite(x));
      }),
      { numRuns: 2000 },
    );
  });
});

describe('the remembered grids', () => {
  it('answers the same engine and conditions with the same grids, and builds afresh once forgotten or when a value changes', () => {
    const c = resolveConditions(fourCylinder);
    const first = gridsFor(fourCylinder, c, 12);
    expect(gridsFor(fourCylinder, c, 12)).toBe(first);
    forgetLastGrids();
    const again = gridsFor(fourCylinder, c, 12);
    expect(again).not.toBe(first);
    // Built afresh, the grids hold the same rpm points.
    expect([...again.sweep.rpm]).toEqual([...first.sweep.rpm]);
    expect(gridsFor({ ...fourCylinder, idleRpm: 850 }, c, 12)).not.toBe(again);
  });
});
