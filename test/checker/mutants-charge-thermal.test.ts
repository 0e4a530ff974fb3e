/**
 * The coil's charge (charge.ts), the iron ballast's resistivity and self-heating (thermal.ts) and the
 * no-spark words (no-spark.ts), held at their edges and checked by an independent method. Written
 * against the mutation-testing survivors (npm run mutate).
 *
 * Sources: the RL step i = I_f (1 - e^(-t/tau)) (any circuits text); the mean square of a current is
 * (1/T) times the integral of i^2 over the period (definition of the RMS value), here worked by
 * Simpson's rule, a method independent of the closed form the code uses; linear interpolation
 * between the rows of the iron resistivity table, whose values are the code's own (from memory,
 * restated here); the bisection's fixed point T = T_amb + theta P(T).
 */
import { describe, expect, it } from 'vitest';
import { chargeCurrentA, meanSquareCurrentA2, meanSquareWithChargeA2, timeToReachS } from '../../electron/checker/charge.js';
import { ironResistivityMicroOhmCm, selfHeatedTemperatureK } from '../../electron/checker/thermal.js';
import { moduleCutOut, noSparkWords } from '../../electron/checker/no-spark.js';
import { prepareSetup } from '../../electron/checker/prepare.js';
import { checkSetup } from '../../electron/checker/index.js';
import { createSession } from '../../electron/checker/session.js';
import { cdModule, fourCylinder, module, moduleSetup, pointsSetup } from './fixtures.js';
import { simpson } from './worked-laws.js';


/** Mean square of the charging current by quadrature: the ramp to the limit, then the limit held. */
function meanSquareByQuadrature(iF: number, tau: number, dwell: number, period: number, limit: number): number {
  const td = Math.min(dwell, period);
  const i = (t: number): number => Math.min(limit, iF * (1 - Math.exp(-t / tau)));
  // Split at the time the limit is reached, -tau ln(1 - I_lim / I_f), so each piece is smooth.
  const tl = limit < iF ? Math.min(td, -tau * Math.log(1 - limit / iF)) : td;
  return (simpson((t) => i(t) ** 2, 0, tl) + simpson((t) => i(t) ** 2, tl, td)) / period;
}

describe('mean square coil current against quadrature of i(t)^2', () => {
  const tau = 1.2e-3;
  const cases: Array<[string, number, number, number, number]> = [
    // [what, I_f, dwell, period, limit]
    ['no limit, dwell well inside the period', 6, 3e-3, 10e-3, Infinity],
    ['a limit reached half-way through the dwell', 8, 4e-3, 10e-3, 5.5],
    ['a limit never reached in a short dwell', 8, 0.3e-3, 2e-3, 7],
    ['a dwell longer than the period charges for the whole period', 6, 12e-3, 5e-3, Infinity],
    ['a dwell longer than the period, with a limit', 8, 12e-3, 5e-3, 6],
  ];
  for (const [what, iF, dwell, period, limit] of cases) {
    it(what, () => {
      const expected = meanSquareByQuadrature(iF, tau, dwell, period, limit);
      expect(meanSquareCurrentA2(iF, tau, dwell, period, limit) / expected).toBeCloseTo(1, 9);
    });
  }
  it('uses a caller\'s 1 - e^(-t_d/tau) only when it belongs to the dwell charged', () => {
    // Dwell 12 ms in a 5 ms period: the caller's fraction is for 12 ms, but the coil charges 5 ms.
    const fractionFor12ms = 1 - Math.exp(-12e-3 / tau);
    const expected = meanSquareByQuadrature(6, tau, 12e-3, 5e-3, Infinity);
    expect(meanSquareWithChargeA2(6, tau, 12e-3, 5e-3, Infinity, Infinity, fractionFor12ms) / expected).toBeCloseTo(1, 9);
  });
  it('without inductance the current stands at the final value, or at the limit, for the whole dwell', () => {
    // i = min(I_lim, I_f) from the start: mean square = I^2 t_d / T.
    expect(meanSquareCurrentA2(8, 0, 4e-3, 10e-3, 5)).toBeCloseTo((25 * 4e-3) / 10e-3, 12);
    expect(meanSquareCurrentA2(8, 0, 4e-3, 10e-3, Infinity)).toBeCloseTo((64 * 4e-3) / 10e-3, 12);
  });
  it('nothing flows without a drive, a dwell or a period', () => {
    expect(meanSquareCurrentA2(-3, tau, 3e-3, 10e-3, Infinity)).toBe(0);
    expect(meanSquareCurrentA2(6, tau, -3e-3, 10e-3, Infinity)).toBe(0);
    expect(meanSquareCurrentA2(6, tau, 3e-3, -10e-3, Infinity)).toBe(0);
  });
});

describe('the RL charge stays between zero and the final current (i = I_f (1 - e^(-t/tau)))', () => {
  it('gives no current for a negative drive or a negative time', () => {
    expect(chargeCurrentA(-5, 2e-3, 1e-3)).toBe(0);
    expect(chargeCurrentA(5, 2e-3, -1e-3)).toBe(0);
    expect(chargeCurrentA(Number.NaN, 2e-3, 1e-3)).toBe(0);
  });
  it('a coil without a usable time constant is at its final current at once', () => {
    expect(chargeCurrentA(5, -2e-3, 1e-3)).toBe(5);
    expect(chargeCurrentA(5, Number.NaN, 1e-3)).toBe(5);
  });
  it('the time to a current already passed (zero or below) is zero, never negative', () => {
    expect(timeToReachS(8, 2e-3, -1)).toBe(0);
    // And the law in the middle: -tau ln(1 - 2/8).
    expect(timeToReachS(8, 2e-3, 2)).toBeCloseTo(-2e-3 * Math.log(0.75), 15);
  });
});

describe('iron resistivity by linear interpolation between the table rows (values from memory)', () => {
  // The rows, restated: K, micro-ohm cm.
  const rows: Array<[number, number]> = [
    [200, 5.2], [273, 8.57], [293, 9.61], [300, 9.98], [400, 16.1], [500, 23.7], [600, 32.9],
    [700, 44.0], [800, 57.1], [900, 72.4], [1000, 87.0], [1100, 103.0], [1200, 112.0],
  ];
  const lerp = (a: [number, number], b: [number, number], t: number): number => a[1] + ((b[1] - a[1]) * (t - a[0])) / (b[0] - a[0]);
  it('reads each row back exactly and each midpoint on the straight line between rows', () => {
    for (let k = 0; k < rows.length; k++) {
      expect(ironResistivityMicroOhmCm(rows[k]![0])).toBeCloseTo(rows[k]![1], 10);
      if (k > 0) {
        const mid = 0.5 * (rows[k - 1]![0] + rows[k]![0]);
        expect(ironResistivityMicroOhmCm(mid)).toBeCloseTo(lerp(rows[k - 1]!, rows[k]!, mid), 10);
      }
    }
  });
  it('below room temperature uses the row pair around it (250 K between 200 and 273 K)', () => {
    expect(ironResistivityMicroOhmCm(250)).toBeCloseTo(5.2 + (3.37 * 50) / 73, 10);
    expect(ironResistivityMicroOhmCm(280)).toBeCloseTo(lerp(rows[1]!, rows[2]!, 280), 10);
  });
  it('extends each end with its last slope, and never goes below 0.5', () => {
    // 1300 K: 112 + 9 x 100 / 100 = 121; 150 K: 5.2 - 3.37 x 50 / 73.
    expect(ironResistivityMicroOhmCm(1300)).toBeCloseTo(121, 10);
    expect(ironResistivityMicroOhmCm(150)).toBeCloseTo(5.2 - (3.37 * 50) / 73, 10);
    // The low extension reaches 0.5 at 200 - 4.7 x 73 / 3.37 = 98.2 K; below that it is held.
    expect(ironResistivityMicroOhmCm(50)).toBe(0.5);
  });
});

describe('self-heated temperature, the fixed point of T = T_amb + theta P(T)', () => {
  it('a resistor carrying nothing stays exactly at the surroundings', () => {
    expect(selfHeatedTemperatureK(300, 40, () => 0)).toBe(300);
  });
  it('a heater that outruns 1500 K above the surroundings is reported at that ceiling', () => {
    expect(selfHeatedTemperatureK(300, 40, () => 1000)).toBe(1800);
  });
  it('a constant 2 W through 40 K/W settles 80 K up', () => {
    expect(selfHeatedTemperatureK(300, 40, () => 2)).toBeCloseTo(380, 6);
  });
});

describe('no-spark words and the inductive module cut-out', () => {
  const s = createSession(fourCylinder, undefined, { rpmPoints: 8 });
  const prep = prepareSetup(s.engine, moduleSetup(module({ supplyMinV: 6 })), s.conditions, s.model);
  it('says which supply case and the two voltages, with a dash for a supply not worked out', () => {
    const p = { ...prep, moduleSupplyCrankingV: 5.5, moduleSupplyRunningV: Number.NaN, moduleSupplyRestingV: 4 };
    const w = noSparkWords(p);
    expect(w.cranking).toBe('No spark while cranking: the module sees 5.50 V, below the 6.00 V it needs to switch the coil.');
    expect(w.running).toBe('No spark while running: the module sees - V, below the 6.00 V it needs to switch the coil.');
    expect(w.resting).toBe('No spark below the dynamo\'s cut-in: the module sees 4.00 V, below the 6.00 V it needs to switch the coil.');
  });
  it('an inductive module switches at its minimum supply and not below it', () => {
    expect(moduleCutOut(prep, 6)).toBe(false);
    expect(moduleCutOut(prep, 5.99)).toBe(true);
    expect(moduleCutOut(prep, null)).toBe(false);
  });
  it('points have no module to cut out', () => {
    const points = prepareSetup(s.engine, pointsSetup(), s.conditions, s.model);
    expect(moduleCutOut(points, 1)).toBe(false);
  });
  it('a CD unit between its charger cut-out and its minimum supply still charges (cut-out 0.75 x minimum, from memory)', () => {
    // Minimum 10 V, so the charger cuts out at 7.5 V; the 12 V car's module sees about 9.1 V cranking.
    const cd = moduleSetup(cdModule({ supplyMinV: 10, supplyMaxV: 16 }));
    const r = checkSetup(fourCylinder, cd);
    const v = r.circuit.moduleSupplyCrankingV!;
    expect(v).toBeLessThan(10);
    expect(v).toBeGreaterThan(0.75 * 10);
    expect(r.keyPoints.cranking.noSparkReason).toBeNull();
    expect(r.keyPoints.cranking.storedEnergyJ).toBeGreaterThan(0);
    expect(moduleCutOut(prepareSetup(s.engine, cd, s.conditions, s.model), v)).toBe(false);
  });
});
