/**
 * The physics functions at their edges and in their middles, each expected value worked out here
 * from the law named beside it. Written against the mutation-testing survivors (npm run mutate).
 */
import { describe, expect, it } from 'vitest';
import { copperResistanceAt20COhm, copperResistanceOhm, finalCurrentA } from '../../electron/checker/primary.js';
import { currentLimitedDwellS, dwellFractionFromAngle, floatedDwellFraction, sparkRateHz } from '../../electron/checker/dwell.js';
import { chargeCurrentA, inductorEnergyJ, meanSquareCurrentA2, meanSquareWithChargeA2, timeToReachS } from '../../electron/checker/charge.js';
import { magnetoBreakCurrentA } from '../../electron/checker/magneto.js';
import { clearanceVolumeM3, sweptVolumeM3, volumeRatioAtAngle } from '../../electron/checker/geometry.js';
import { compressInto } from '../../electron/checker/compression.js';
import { breakdownV, cylinderStateInto, sparkAngleDegBtdc } from '../../electron/checker/required.js';
import { airBreakdownV, paschenBreakdownFromReducedV, paschenBreakdownV, reducedGapCm } from '../../electron/checker/breakdown.js';
import { dwellGivenLimitTimeS, dwellTimeS, DwellMode, type DwellParams } from '../../electron/checker/timing.js';
import { supplyUnderPowerLoadV } from '../../electron/checker/cranking.js';

describe('copper law, R(T) = R20 (1 + 0.00393 (T - 20)), and Ohm\'s law', () => {
  it('gives 1.2358 x R20 at 80 degC and reads back to R20', () => {
    expect(copperResistanceOhm(3, 80)).toBeCloseTo(3 * (1 + 0.00393 * 60), 12);
    expect(copperResistanceAt20COhm(3 * (1 + 0.00393 * 60), 80)).toBeCloseTo(3, 12);
    expect(copperResistanceAt20COhm(3, 20)).toBe(3);
  });
  it('stays at 5 % of R20 where the linear law would go negative', () => {
    // 1 + 0.00393 (-300 - 20) = -0.2576: held at 0.05.
    expect(copperResistanceOhm(2, -300)).toBeCloseTo(0.1, 12);
    expect(copperResistanceAt20COhm(0.1, -300)).toBeCloseTo(2, 12);
  });
  it('I = (V - V_switch) / R, none without drive or without resistance', () => {
    expect(finalCurrentA(14, 1.5, 2.5)).toBe(5);
    expect(finalCurrentA(1.5, 1.5, 2.5)).toBe(0);
    expect(finalCurrentA(1, 1.5, 2.5)).toBe(0);
    expect(finalCurrentA(14, 0, 1e-6)).toBe(0);
    expect(finalCurrentA(14, 0, 2e-6)).toBeCloseTo(14 / 2e-6, 3);
  });
});

describe('spark rate and dwell', () => {
  it('rpm x cylinders / 120 on a four-stroke, / 60 on a two-stroke', () => {
    expect(sparkRateHz(6000, 4, 'four-stroke')).toBe(200);
    expect(sparkRateHz(6000, 2, 'two-stroke')).toBe(200);
  });
  it('dwell fraction = dwell angle x cylinders / 360, held within 0 and 0.98', () => {
    expect(dwellFractionFromAngle(54, 4)).toBe(0.6);
    expect(dwellFractionFromAngle(90, 4)).toBe(0.98);
    expect(dwellFractionFromAngle(-10, 4)).toBe(0);
  });
  it('points float shrinks the dwell by (float rpm / rpm)^2 above the float rpm only', () => {
    expect(floatedDwellFraction(0.6, 5000, 5000)).toBe(0.6);
    expect(floatedDwellFraction(0.6, 6000, 5000)).toBeCloseTo(0.6 * (5000 / 6000) ** 2, 12);
    expect(floatedDwellFraction(0.6, 6000, null)).toBe(0.6);
    expect(floatedDwellFraction(0.6, 6000, 0)).toBe(0.6);
  });
  it('current-limited dwell: time to the limit plus the hold, capped at the maximum duty', () => {
    // Period 10 ms, maximum duty 0.8: cap 8 ms.
    expect(currentLimitedDwellS(3e-3, 0.5e-3, 10e-3, 0.8)).toBeCloseTo(3.5e-3, 15);
    expect(currentLimitedDwellS(9e-3, 0.5e-3, 10e-3, 0.8)).toBeCloseTo(8e-3, 15);
    expect(currentLimitedDwellS(Infinity, 0.5e-3, 10e-3, 0.8)).toBeCloseTo(8e-3, 15);
  });
  it('each dwell law at one rpm', () => {
    const p: DwellParams = { mode: DwellMode.Cam, camFraction: 0.6, floatRpm: null, fixedDuty: 0.4, maxDuty: 0.8, holdS: 0.5e-3, limitA: 6 };
    expect(dwellGivenLimitTimeS(p, 0.01, 3000, Infinity)).toBeCloseTo(0.006, 15);
    expect(dwellGivenLimitTimeS({ ...p, mode: DwellMode.Magneto }, 0.01, 3000, Infinity)).toBeCloseTo(0.006, 15);
    expect(dwellGivenLimitTimeS({ ...p, mode: DwellMode.FixedDuty }, 0.01, 3000, Infinity)).toBeCloseTo(0.004, 15);
    expect(dwellGivenLimitTimeS({ ...p, mode: DwellMode.Cd }, 0.01, 3000, 1e-3)).toBe(0);
    expect(dwellGivenLimitTimeS({ ...p, mode: DwellMode.CurrentLimited }, 0.01, 3000, 2e-3)).toBeCloseTo(2.5e-3, 15);
    // Current limited, from the RL rise: 8 A final, tau 2 ms, limit 6 A: t = -tau ln(1 - 6/8) = 2 ms x ln 4.
    expect(dwellTimeS({ ...p, mode: DwellMode.CurrentLimited }, 0.1, 3000, 8, 2e-3)).toBeCloseTo(2e-3 * Math.log(4) + 0.5e-3, 12);
    // Any other law ignores the limit: the cam's 0.6 of the period.
    expect(dwellTimeS(p, 0.1, 3000, 8, 2e-3)).toBeCloseTo(0.06, 12);
  });
});

describe('RL charge, i = I_final (1 - e^(-t/tau)), and 0.5 L i^2', () => {
  it('the current after a time, with the edges', () => {
    expect(chargeCurrentA(5, 2e-3, 2e-3)).toBeCloseTo(5 * (1 - Math.exp(-1)), 12);
    expect(chargeCurrentA(0, 2e-3, 2e-3)).toBe(0);
    expect(chargeCurrentA(5, 2e-3, 0)).toBe(0);
    expect(chargeCurrentA(5, 0, 1e-3)).toBe(5);
  });
  it('the time to a target, -tau ln(1 - I / I_final)', () => {
    expect(timeToReachS(8, 2e-3, 6)).toBeCloseTo(-2e-3 * Math.log(1 - 6 / 8), 15);
    expect(timeToReachS(8, 2e-3, 0)).toBe(0);
    expect(timeToReachS(8, 2e-3, 8)).toBe(Infinity);
    expect(timeToReachS(8, 2e-3, 9)).toBe(Infinity);
  });
  it('0.5 L i^2: 8 mH at 4 A is 64 mJ', () => {
    expect(inductorEnergyJ(0.008, 4)).toBeCloseTo(0.064, 15);
  });
  it('the mean square current over a period, from the integral of (1 - e^(-t/tau))^2', () => {
    // I 2 A, tau 1 ms, dwell 2 ms, period 5 ms, no limit:
    // I^2 (td - 2 tau (1 - e^(-2)) + (tau/2)(1 - e^(-4))) / T.
    const tau = 1e-3;
    const noLimit = (4 * (2e-3 - 2 * tau * (1 - Math.exp(-2)) + (tau / 2) * (1 - Math.exp(-4)))) / 5e-3;
    expect(meanSquareCurrentA2(2, tau, 2e-3, 5e-3, Infinity)).toBeCloseTo(noLimit, 12);
    // With a 1.5 A limit: reached at t_l = tau ln 4, then held at 1.5 A for the rest of the dwell.
    const tl = tau * Math.log(4);
    const x = 0.75; // 1 - e^(-t_l / tau) = I_lim / I_final
    const limited = (4 * (tl - 2 * tau * x + 0.5 * tau * x * (2 - x)) + 1.5 * 1.5 * (2e-3 - tl)) / 5e-3;
    expect(meanSquareCurrentA2(2, tau, 2e-3, 5e-3, 1.5)).toBeCloseTo(limited, 12);
    // A limit reached only after the dwell changes nothing.
    expect(meanSquareCurrentA2(2, tau, 0.2e-3, 5e-3, 1.9)).toBeCloseTo((4 * (0.2e-3 - 2 * tau * (1 - Math.exp(-0.2)) + (tau / 2) * (1 - Math.exp(-0.4)))) / 5e-3, 12);
    // No inductance: the full current for the whole dwell; a dwell longer than the period is the period.
    expect(meanSquareCurrentA2(2, 0, 2e-3, 5e-3, Infinity)).toBeCloseTo((4 * 2e-3) / 5e-3, 12);
    expect(meanSquareCurrentA2(2, 0, 8e-3, 5e-3, Infinity)).toBeCloseTo(4, 12);
    expect(meanSquareCurrentA2(2, tau, 0, 5e-3, Infinity)).toBe(0);
    expect(meanSquareCurrentA2(0, tau, 2e-3, 5e-3, Infinity)).toBe(0);
    expect(meanSquareCurrentA2(2, tau, 2e-3, 0, Infinity)).toBe(0);
  });
  it('takes 1 - e^(-t_d/tau) from the caller when given, and only for the whole dwell', () => {
    const tau = 1e-3;
    const x = 1 - Math.exp(-2);
    const expected = (4 * (2e-3 - 2 * tau * x + 0.5 * tau * x * (2 - x))) / 5e-3;
    expect(meanSquareWithChargeA2(2, tau, 2e-3, 5e-3, Infinity, Infinity, x)).toBeCloseTo(expected, 12);
    expect(meanSquareWithChargeA2(2, tau, 2e-3, 5e-3, Infinity, Infinity, Number.NaN)).toBeCloseTo(expected, 12);
    // A wrong fraction given is used as given (the caller vouches for it): 0.5 instead of 0.8647.
    expect(meanSquareWithChargeA2(2, tau, 2e-3, 5e-3, Infinity, Infinity, 0.5)).toBeCloseTo((4 * (2e-3 - 2 * tau * 0.5 + 0.5 * tau * 0.75)) / 5e-3, 12);
  });
});

describe('magneto break current, i ~ x / sqrt(1 + x^2) scaled to the rating at x = 3 (our model)', () => {
  it('gives the rating at the full-output rpm and 1.05 x the rating at most', () => {
    expect(magnetoBreakCurrentA(2000, 4, 2000)).toBeCloseTo(4, 12);
    // x = 1.5 at half speed: 4 x (1.5 / sqrt(3.25)) / (3 / sqrt(10)).
    expect(magnetoBreakCurrentA(1000, 4, 2000)).toBeCloseTo((4 * (1.5 / Math.sqrt(3.25))) / (3 / Math.sqrt(10)), 12);
    // Far above full output the shape tends to 1: 4 x sqrt(10) / 3 = 4.216 A, held at 4.2 A.
    expect(magnetoBreakCurrentA(200_000, 4, 2000)).toBeCloseTo(4.2, 12);
    expect(magnetoBreakCurrentA(0, 4, 2000)).toBe(0);
    expect(magnetoBreakCurrentA(1000, 4, 0)).toBe(0);
    expect(magnetoBreakCurrentA(1000, 0, 2000)).toBe(0);
  });
});

describe('slider-crank volume and polytropic compression (Heywood 1988, section 2.2)', () => {
  it('V/V_c = 1 at TDC and r_c at BDC, and the middle from the formula', () => {
    expect(volumeRatioAtAngle(8, 3.5, 0)).toBeCloseTo(1, 12);
    expect(volumeRatioAtAngle(8, 3.5, 180)).toBeCloseTo(8, 12);
    // 90 degrees: 1 + 3.5 (3.5 + 1 - 0 - sqrt(3.5^2 - 1)).
    expect(volumeRatioAtAngle(8, 3.5, 90)).toBeCloseTo(1 + 3.5 * (4.5 - Math.sqrt(3.5 * 3.5 - 1)), 12);
    // A rod no longer than the crank is taken as R = 1.000001.
    expect(volumeRatioAtAngle(8, 0.5, 90)).toBeCloseTo(1 + 3.5 * (2.000001 - Math.sqrt(1.000001 ** 2 - 1)), 9);
  });
  it('swept volume pi B^2 / 4 x stroke, clearance V_d / (r_c - 1)', () => {
    expect(sweptVolumeM3(0.08, 0.09)).toBeCloseTo((Math.PI * 0.08 * 0.08 * 0.09) / 4, 15);
    expect(clearanceVolumeM3(0.08, 0.09, 9)).toBeCloseTo((Math.PI * 0.08 * 0.08 * 0.09) / 4 / 8, 15);
    expect(clearanceVolumeM3(0.08, 0.09, 1)).toBeCloseTo((Math.PI * 0.08 * 0.08 * 0.09) / 4 / 1e-9, 0);
  });
  it('p = p1 r^n and T = T1 r^(n - 1)', () => {
    const out = compressInto({ pressurePa: 0, temperatureK: 0 }, 100_000, 300, 8, 1.3);
    expect(out.pressurePa).toBeCloseTo(100_000 * 8 ** 1.3, 6);
    expect(out.temperatureK).toBeCloseTo(300 * 8 ** 0.3, 9);
    const tiny = compressInto({ pressurePa: 0, temperatureK: 0 }, 100_000, 300, 0, 1.3);
    expect(tiny.pressurePa).toBeCloseTo(100_000 * 1e-6 ** 1.3, 12);
  });
});

describe('spark angle and the cylinder state at the spark', () => {
  const curve = [{ rpm: 1000, advanceDeg: 0 }, { rpm: 3000, advanceDeg: 20 }, { rpm: 4500, advanceDeg: 24 }];
  it('static plus the curve, interpolated and held flat beyond its ends', () => {
    expect(sparkAngleDegBtdc(8, [], 2000)).toBe(8);
    expect(sparkAngleDegBtdc(8, curve, 500)).toBe(8);
    expect(sparkAngleDegBtdc(8, curve, 1000)).toBe(8);
    expect(sparkAngleDegBtdc(8, curve, 2000)).toBe(18);
    expect(sparkAngleDegBtdc(8, curve, 3000)).toBe(28);
    expect(sparkAngleDegBtdc(8, curve, 3750)).toBe(30);
    expect(sparkAngleDegBtdc(8, curve, 4500)).toBe(32);
    expect(sparkAngleDegBtdc(8, curve, 9000)).toBe(32);
    // Two rows at one rpm: the later one holds from there.
    expect(sparkAngleDegBtdc(8, [{ rpm: 1000, advanceDeg: 0 }, { rpm: 2000, advanceDeg: 10 }, { rpm: 2000, advanceDeg: 14 }, { rpm: 3000, advanceDeg: 20 }], 2500)).toBe(8 + 14 + 3);
  });
  it('takes the angle either side of TDC alike and no further than 170 degrees', () => {
    const at = (deg: number) => cylinderStateInto({ pressurePa: 0, temperatureK: 0 }, 8, 3.5, deg, 100_000, 300, 1.3).pressurePa;
    // At TDC V1/V = r_c: p = p1 x 8^1.3.
    expect(at(0)).toBeCloseTo(100_000 * 8 ** 1.3, 6);
    expect(at(-30)).toBeCloseTo(at(30), 9);
    expect(at(175)).toBeCloseTo(at(170), 9);
    const v = volumeRatioAtAngle(8, 3.5, 30);
    expect(at(30)).toBeCloseTo(100_000 * (8 / v) ** 1.3, 6);
  });
  it('breakdown by the law chosen, on the density-reduced gap', () => {
    // 1 mm at 1 atm and 293 K: x = 0.1 cm.
    expect(breakdownV('empirical-air', 1e-3, 101_325, 293)).toBeCloseTo(1000 * (24.22 * 0.1 + 6.08 * Math.sqrt(0.1)), 6);
    // Paschen: 365 pd / (ln(15 pd) - ln ln(1 + 1/0.01)), pd = 0.1 x 760 Torr cm.
    expect(breakdownV('paschen', 1e-3, 101_325, 293)).toBeCloseTo((365 * 76) / (Math.log(15 * 76) - Math.log(Math.log(101))), 6);
  });
});

describe('breakdown laws at their edges', () => {
  it('reduces the gap by density and refuses a temperature under 1 K', () => {
    expect(reducedGapCm(1e-3, 2 * 101_325, 586)).toBeCloseTo(0.1, 12);
    expect(reducedGapCm(1e-3, 101_325, 0)).toBeCloseTo(0.1 * 293, 9);
  });
  it('needs nothing for a negative gap under the air law', () => {
    expect(airBreakdownV(-1)).toBe(0);
    // 1 cm at 1 atm: 24.22 + 6.08 = 30.3 kV (about 30 kV published).
    expect(airBreakdownV(1)).toBeCloseTo(30_300, 6);
  });
  it('holds Paschen\'s law at its minimum left of it', () => {
    // The minimum is at pd = e^(1 + ln ln(101)) / 15, where V = 365 e ln(101) / 15 ... in closed form
    // V_min = B pd_min / 1 (the denominator is 1 there).
    const pdMin = Math.exp(1 + Math.log(Math.log(101))) / 15;
    expect(paschenBreakdownV(pdMin / 10)).toBeCloseTo(365 * pdMin, 9);
    expect(paschenBreakdownV(pdMin)).toBeCloseTo(365 * pdMin, 9);
    expect(paschenBreakdownFromReducedV(-1)).toBeCloseTo(365 * pdMin, 9);
    // 1 cm at 1 atm: 365 x 760 / (ln(15 x 760) - ln ln 101).
    expect(paschenBreakdownFromReducedV(1)).toBeCloseTo((365 * 760) / (Math.log(15 * 760) - Math.log(Math.log(101))), 6);
  });
});

describe('a supply loaded by a charger of power P through a feed resistance', () => {
  it('V_m = (V + sqrt(V^2 - 4 R P)) / 2, or half the supply when the feed cannot deliver P', () => {
    // 12 V, 0.5 ohm, 40 W: (12 + sqrt(144 - 80)) / 2 = 10 V (and 0.5 x 40 / 10 = 2 V dropped).
    expect(supplyUnderPowerLoadV(12, 0.5, 40)).toBeCloseTo(10, 12);
    expect(supplyUnderPowerLoadV(12, 1, 36)).toBe(6);
    expect(supplyUnderPowerLoadV(12, 2, 40)).toBe(6);
    expect(supplyUnderPowerLoadV(12, 0, 40)).toBe(12);
  });
});
