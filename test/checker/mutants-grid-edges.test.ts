/**
 * The rpm grid (electron/checker/grid.ts) held at its edges: a dynamo's cut-in speed, a point with
 * no sparks, the rounding unit of the sweep's step, the two ends of an evenly filled stretch, the
 * entered speeds that are not kept (at cranking, above the sweep, entered twice, more than the
 * points), an anchor that pushes an equal point aside, the four key points, the idle and redline
 * indices, and the polytropic index the cylinder state is computed with. Written against the
 * mutation-testing survivors (npm run mutate).
 *
 * Sources: grid.ts's doc comments (quoted beside each check); types.ts (a dynamo gives nothing
 * below cut-in, `charging` absent means an alternator); compression.ts (p = p1 (V1/V)^n,
 * T = T1 (V1/V)^(n-1), p1 = volumetric efficiency x ambient pressure, the index about 1.3, Heywood
 * 1988 from memory); required.ts (the charge closed at BDC, V1 = r_c Vc, so at TDC V1/V = r_c); a
 * four-stroke fires each cylinder once every two revolutions (common practice); the compression
 * index of a real charge lies between 1 (isothermal) and the adiabatic 1.4 (any thermodynamics
 * text). Expected values are worked here by hand from those.
 */
import { describe, expect, it } from 'vitest';
import { buildGrids, forgetLastGrids, gridsFor, sweepRpm } from '../../electron/checker/grid.js';
import { resolveConditions } from '../../electron/checker/conditions.js';
import type { EngineSpec, ResolvedConditions } from '../../electron/checker/types.js';
import { fourCylinder } from './fixtures.js';

const rising = (a: ArrayLike<number>): boolean => Array.from(a).every((x, i, all) => i === 0 || x > all[i - 1]!);
const withCutIn = (e: EngineSpec, rpm: number): ResolvedConditions => resolveConditions(e, { dynamoCutInRpm: { value: rpm, provenance: 'measured' } });
/** Sparks per second of a four-stroke: each cylinder fires once every two revolutions (common practice). */
const fourStrokeHz = (rpm: number, cylinders: number): number => (rpm * cylinders) / 120;

// fourCylinder: cranking 180, idle 800, redline 6000 rpm; 110 % of redline is 6600. Six points
// evenly from 180 to 6600 step 1284: 180, 1464, 2748, 4032, 5316, 6600; idle 800 takes 1464's
// place and redline 6000 takes 5316's (grid.ts doc: "the entered idle and redline exactly in place
// of their nearest points").
const SIX = [180, 800, 2748, 4032, 6000, 6600];

describe('a dynamo car rests below cut-in only (grid.ts doc: "1 at a running point below a dynamo\'s cut-in speed")', () => {
  const dynamo: EngineSpec = { ...fourCylinder, charging: 'dynamo' };

  it('a point exactly at the cut-in speed is not below it, so not resting', () => {
    // Cut-in at 2748 rpm, an even point of the six: 800 lies below it, 2748 does not.
    const g = buildGrids(dynamo, withCutIn(dynamo, 2748), 6);
    expect(Array.from(g.sweep.rpm)).toEqual(SIX);
    // Cranking (index 0) is on the cranking supply, never "resting" (doc: "a running point").
    expect(Array.from(g.sweep.resting)).toEqual([0, 1, 0, 0, 0, 0]);
  });

  it('a cut-in exactly at idle: the idle point (sweep and key) is not resting', () => {
    const g = buildGrids(dynamo, withCutIn(dynamo, 800), 6);
    expect(Array.from(g.sweep.resting)).toEqual([0, 0, 0, 0, 0, 0]);
    // Key points: cranking, idle 800, mid-range, redline (grid.ts doc: "Four points").
    expect(g.key.rpm[1]).toBe(800);
    expect(Array.from(g.key.resting)).toEqual([0, 0, 0, 0]);
  });

  it('with the default cut-in (1100 rpm, conditions.ts) the idle point at 800 rests', () => {
    const g = buildGrids(dynamo, resolveConditions(dynamo), 6);
    expect(Array.from(g.sweep.resting)).toEqual([0, 1, 0, 0, 0, 0]);
    expect(Array.from(g.key.resting)).toEqual([0, 1, 0, 0]);
  });

  it('never with an alternator, whatever cut-in is given (grid.ts doc: "always 0 with an alternator"; types.ts: absent means alternator)', () => {
    for (const charging of ['alternator', undefined] as const) {
      const e: EngineSpec = { ...fourCylinder, charging };
      for (const c of [withCutIn(e, 2748), resolveConditions(e)]) {
        const g = buildGrids(e, c, 6);
        expect(Array.from(g.sweep.resting), `charging ${charging}`).toEqual([0, 0, 0, 0, 0, 0]);
        expect(Array.from(g.key.resting), `charging ${charging}`).toEqual([0, 0, 0, 0]);
      }
    }
  });
});

describe('spark rate and period at each point', () => {
  it('the period is 1/f with f = rpm x cylinders / 120 on a four-stroke (common practice)', () => {
    const g = buildGrids(fourCylinder, resolveConditions(fourCylinder), 6);
    SIX.forEach((rpm, i) => {
      const f = fourStrokeHz(rpm, 4);
      expect(g.sweep.sparkRateHz[i], `${rpm} rpm`).toBeCloseTo(f, 9);
      expect(g.sweep.periodS[i]! * f, `${rpm} rpm`).toBeCloseTo(1, 12);
    });
    // 180 rpm cranking: 6 sparks a second, one every 1/6 s.
    expect(g.key.periodS[0]).toBeCloseTo(1 / 6, 12);
  });

  it('a point with no sparks (idle entered as 0 rpm: f = 0) gets a finite period, not 1/0', () => {
    const e: EngineSpec = { ...fourCylinder, idleRpm: 0 };
    const g = buildGrids(e, resolveConditions(e), 6);
    expect(g.key.rpm[1]).toBe(0);
    expect(g.key.sparkRateHz[1]).toBe(0);
    expect(Number.isFinite(g.key.periodS[1]), `${g.key.periodS[1]} s`).toBe(true);
    expect(g.key.periodS[1]).toBeGreaterThan(0);
  });
});

describe('the rounding unit of the step (grid.ts doc: "the coarsest of 1, 1/2, 1/5, 1/10, 1/20 ... rpm that is no larger than step")', () => {
  it('a step of 1/3 rpm rounds the inner points to 1/5 rpm', () => {
    // Cranking 100, idle and redline under it (no anchors): the top is 1 % above cranking, 101
    // (span 1, unit 1). Four points: step 1/3 rpm; of 1, 1/2, 1/5 the first no larger is 1/5.
    const e: EngineSpec = { ...fourCylinder, crankingRpm: 100, idleRpm: 50, redlineRpm: 50 };
    const on5 = (x: number) => Math.round(x * 5) / 5;
    const expected = [100, on5(100 + 1 / 3), on5(100 + 2 / 3), 101];
    expect(expected).toEqual([100, 100.4, 100.6, 101]);
    expect(Array.from(sweepRpm(e, 4))).toEqual(expected);
  });

  it('a step equal to a unit takes that unit: 1/2 rpm steps stay on the half rpm', () => {
    // Cranking 100.5: the top is 1 % above, 101.505, on the whole rpm (span 1.005) 102. Four
    // points step (102 - 100.5)/3 = 0.5 rpm: 1/2 is no larger than 0.5, so that is the unit and the
    // points fall exactly on it.
    const e: EngineSpec = { ...fourCylinder, crankingRpm: 100.5, idleRpm: 50, redlineRpm: 50 };
    expect(Array.from(sweepRpm(e, 4))).toEqual([100.5, 101, 101.5, 102]);
  });

  it('a step under the finest unit (1/10000 rpm) keeps its exact even values (grid.ts: "a tiny range keeps its exact values")', () => {
    // Cranking 1, top 1.01 (1 % above, on 1/100 rpm). 151 points: step 0.01/150 = 6.7e-5 rpm, under
    // the finest unit 1/10000 rpm (1, 1/2, 1/5 ... twelve steps down, as the other sweep tests
    // state), so rounding would merge points and the exact values stay.
    const e: EngineSpec = { ...fourCylinder, crankingRpm: 1, idleRpm: 0.5, redlineRpm: 0.5 };
    const n = 151;
    const rpm = sweepRpm(e, n);
    const step = (1.01 - 1) / (n - 1);
    expect(step).toBeLessThan(1e-4);
    expect(step).toBeGreaterThan(5e-5);
    expect(rpm[0]).toBe(1);
    expect(rpm[n - 1]).toBe(1.01);
    for (const m of [1, 2, 3, 75, 149]) expect(rpm[m], `point ${m}`).toBe(1 + step * m);
    expect(rising(rpm)).toBe(true);
  });
});

describe('an evenly filled stretch keeps both ends exact (grid.ts doc: "from lo to hi (both exact), the inner ones round")', () => {
  it('the top on the half rpm stays there though the inner points round to 1/5 rpm', () => {
    // Cranking 60, idle and redline under it: the top is 1 % above cranking, 60.6; the span 0.6
    // takes the unit 1/2, so the top is 60.5. Three points: step 0.25, unit 1/5: the middle
    // 60.25 -> 60.2, the top 60.5 exact (60.5 is not on the 1/5 rpm grid: it would read 60.6).
    const e: EngineSpec = { ...fourCylinder, crankingRpm: 60, idleRpm: 30, redlineRpm: 30 };
    const top = Math.round(60 * 1.01 * 2) / 2;
    expect(top).toBe(60.5);
    expect(Array.from(sweepRpm(e, 3))).toEqual([60, Math.round(60.25 * 5) / 5, top]);
  });
});

describe('the entered speeds kept exactly: only those above cranking, within the sweep, once each (grid.ts)', () => {
  // Three points with one anchor (redline): evenly 180, 3390, 6600, redline 6000 in place of 3390.
  it('an idle equal to cranking is not a second point at cranking: the points still rise', () => {
    const e: EngineSpec = { ...fourCylinder, idleRpm: 180 };
    const rpm = Array.from(sweepRpm(e, 3));
    expect(rising(rpm)).toBe(true);
    expect(rpm).toEqual([180, 6000, 6600]);
  });

  it('an idle above 110 % of redline is left out: the sweep still ends at 110 % of redline', () => {
    const e: EngineSpec = { ...fourCylinder, idleRpm: 7000 };
    // 110 % of 6000 on whole rpm (grid.ts doc: "on round values"): 6600.
    expect(Array.from(sweepRpm(e, 3))).toEqual([180, 6000, Math.round(1.1 * 6000)]);
  });

  it('idle entered equal to redline appears once: the points still rise to 110 % of redline', () => {
    const e: EngineSpec = { ...fourCylinder, idleRpm: 6000 };
    const rpm = Array.from(sweepRpm(e, 3));
    expect(rising(rpm)).toBe(true);
    expect(rpm).toEqual([180, 6000, 6600]);
  });

  it('called with two points, cranking and redline (grid.ts doc: "called directly with n = 2, cranking and redline")', () => {
    expect(Array.from(sweepRpm(fourCylinder, 2))).toEqual([180, 6000]);
  });
});

describe('an anchor landing on a point of equal value is re-spaced (grid.ts: "re-space evenly wherever an anchor pushed aside broke the order")', () => {
  it('redline equal to the even point it must leave room above: re-spaced, never two equal points', () => {
    // Cranking 100, redline 1000, top 110 % = 1100, idle entered at 1100 (the top). Eleven points
    // evenly step 100: 100, 200, ..., 1100. Redline keeps a point free above it for idle, so the
    // highest it may take is index 8 (900); the point after it already reads 1000 - equal, not
    // rising. Between redline (index 8) and the top (index 10) the points are re-spaced evenly:
    // 1000, 1050, 1100.
    const e: EngineSpec = { ...fourCylinder, crankingRpm: 100, redlineRpm: 1000, idleRpm: 1100 };
    const rpm = Array.from(sweepRpm(e, 11));
    expect(rpm).toEqual([100, 200, 300, 400, 500, 600, 700, 800, 1000, (1000 + 1100) / 2, 1100]);
    expect(rising(rpm)).toBe(true);
  });
});

describe('an anchor exactly between two points', () => {
  it('takes the lower one, leaving the points above for the anchors above it (grid.ts doc: "keeping room for the anchors above it")', () => {
    // Five points evenly 180, 1785, 3390, 4995, 6600 (step 1605). Idle 2587.5 lies exactly between
    // 1785 and 3390 (802.5 from each). Taking the lower (index 1) leaves 3390 and 4995 open to
    // redline, which takes the nearer, 4995 -> [180, 2587.5, 3390, 6000, 6600].
    // (The doc says "nearest"; on a tie, the lower point is our reading of "keeping room above".)
    const e: EngineSpec = { ...fourCylinder, idleRpm: 2587.5 };
    expect(2587.5 - 1785).toBe(3390 - 2587.5);
    expect(Array.from(sweepRpm(e, 5))).toEqual([180, 2587.5, 3390, 6000, 6600]);
  });
});

describe('the key points and the idle and redline indices', () => {
  it('key points: cranking (on the cranking supply), idle, mid-range, redline (grid.ts doc)', () => {
    const g = buildGrids(fourCylinder, resolveConditions(fourCylinder), 6);
    expect(g.key.rpm[0]).toBe(180);
    expect(g.key.rpm[1]).toBe(800);
    expect(g.key.rpm[2]).toBeGreaterThan(800);
    expect(g.key.rpm[2]).toBeLessThan(6000);
    expect(g.key.rpm[3]).toBe(6000);
    expect(Array.from(g.key.cranking)).toEqual([1, 0, 0, 0]);
    expect(g.key.sparkRateHz[0]).toBeCloseTo(fourStrokeHz(180, 4), 12);
  });

  it('an idle above every point: the index still names a sweep point, the top (the nearest to that idle)', () => {
    // Idle 7000 above the top 6600: no point is at or above it.
    const e: EngineSpec = { ...fourCylinder, idleRpm: 7000 };
    const g = buildGrids(e, resolveConditions(e), 6);
    expect(g.sweep.rpm[5]).toBe(6600);
    expect(g.idleIndex).toBeGreaterThanOrEqual(0);
    expect(g.idleIndex).toBeLessThan(g.sweep.n);
    expect(g.idleIndex).toBe(5);
  });

  it('an idle at or below cranking: the idle index is the first running point, never the cranking point', () => {
    // grid.ts doc: the sweep is "cranking speed (on the cranking supply) then running points";
    // idle is a running speed, so its index is that of a running point: the first, index 1.
    for (const idleRpm of [180, 100]) {
      const e: EngineSpec = { ...fourCylinder, idleRpm };
      const g = buildGrids(e, resolveConditions(e), 6);
      expect(g.sweep.cranking[0]).toBe(1);
      expect(g.idleIndex, `idle ${idleRpm}`).toBe(1);
    }
  });

  it('redline exactly a sweep point: the redline index is that point (doc: "the last point at or below redline")', () => {
    const g = buildGrids(fourCylinder, resolveConditions(fourCylinder), 6);
    expect(g.sweep.rpm[4]).toBe(6000);
    expect(g.redlineIndex).toBe(4);
    expect(g.idleIndex).toBe(1);
  });
});

describe('the polytropic index the cylinder state is computed with', () => {
  // Spark at TDC (static 0, no advance): with the charge closed at BDC, V1/V = r_c = 8 (required.ts),
  // so p = p1 8^n and T = T1 8^(n-1) (compression.ts), p1 = VE x ambient pressure, T1 the inlet charge.
  const tdc: EngineSpec = { ...fourCylinder, staticTimingDegBtdc: 0, advanceCurve: [{ rpm: 1000, advanceDeg: 0 }] };
  const base = resolveConditions(tdc);
  const withIndex = (n: number): ResolvedConditions => ({ ...base, polytropicIndex: { value: n, provenance: 'measured' } });
  const p1 = base.volumetricEfficiency.value * base.ambientPressurePa.value;
  const t1 = base.inletChargeC.value + 273.15;

  /** The redline key point (a running point) against the law at index n. */
  function expectIndex(given: number, n: number): void {
    const g = buildGrids(tdc, withIndex(given), 6);
    expect(g.key.sparkAngleDegBtdc[3]).toBe(0);
    expect(g.key.pressurePa[3]! / (p1 * 8 ** n), `given ${given}`).toBeCloseTo(1, 9);
    expect(g.key.temperatureK[3]! / (t1 * 8 ** (n - 1)), `given ${given}`).toBeCloseTo(1, 9);
  }

  it('an index of 1 (isothermal) is used: the charge stays at the inlet temperature, p = 8 p1', () => {
    expectIndex(1, 1);
    const g = buildGrids(tdc, withIndex(1), 6);
    expect(g.key.temperatureK[3]).toBeCloseTo(t1, 9);
  });

  it('an index inside 1..1.4 is used as given', () => {
    expectIndex(1.2, 1.2);
  });

  it('an index below 1, not a number or infinite is no compression index: the default 1.3 stands (conditions.ts, Heywood 1988)', () => {
    expect(base.polytropicIndex.value).toBe(1.3);
    for (const bad of [0.5, 0, -1, Number.NaN, Number.POSITIVE_INFINITY]) expectIndex(bad, 1.3);
  });
});

describe('the remembered grids', () => {
  it('a second call with a longer advance curve (same rows first) builds afresh', () => {
    forgetLastGrids();
    const c = resolveConditions(fourCylinder);
    const first = gridsFor(fourCylinder, c, 6);
    const longer: EngineSpec = { ...fourCylinder, advanceCurve: [...fourCylinder.advanceCurve, { rpm: 5500, advanceDeg: 26 }] };
    const second = gridsFor(longer, c, 6);
    expect(second).not.toBe(first);
    // 5500 rpm lies past the old curve's last row (24 deg at 4500): held at 24 before, 26 now.
    const at6000 = (g: typeof first) => g.key.sparkAngleDegBtdc[3]!;
    expect(at6000(first)).toBe(8 + 24);
    expect(at6000(second)).toBe(8 + 26);
    // And back to the shorter curve: built afresh again, not the longer one's grids.
    expect(gridsFor(fourCylinder, c, 6)).not.toBe(second);
    forgetLastGrids();
  });
});

describe('the fewest points (grid.ts doc: "n = 2, cranking and redline; with n = 1, cranking alone; with none, none")', () => {
  it('gives cranking alone for one point, and an empty sweep for none (it once looped for ever there)', () => {
    expect(Array.from(sweepRpm(fourCylinder, 1))).toEqual([180]);
    expect(sweepRpm(fourCylinder, 0).length).toBe(0);
    expect(sweepRpm(fourCylinder, -3).length).toBe(0);
  });
});
