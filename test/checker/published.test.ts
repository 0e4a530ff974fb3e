/**
 * Published values, each checked against its source (named beside the check).
 */
import { describe, expect, it } from 'vitest';
import {
  airBreakdownV,
  capacitorEnergyJ,
  chargeCurrentA,
  copperResistanceOhm,
  crankingFloorV,
  compressInto,
  dwellFractionFromAngle,
  finalCurrentA,
  inductorEnergyJ,
  paschenBreakdownFromReducedV,
  reducedGapCm,
  secondaryDampingFactor,
  sparkRateHz,
  volumeRatioAtAngle,
  cdSecondaryPeakV,
  availableSecondaryV,
  voltsPerAmp,
  effectiveSecondaryCapacitanceF,
  cdOvershootFraction,
  cdTransferDampingRatio,
  leakageInductanceH,
  reflectedShuntOhm,
  fouledChargeTauS,
  fouledTimeToLimitS,
  fouledFluxCurrentA,
  timeToReachS,
} from '../../electron/checker/index.js';

describe('Alexander & Sadiku, Fundamentals of Electric Circuits, sec. 7.9 (automobile ignition)', () => {
  it('gives 3 A and 27 mJ for 12 V, 4 ohm, 6 mH', () => {
    const i = finalCurrentA(12, 0, 4);
    expect(i).toBeCloseTo(3, 10);
    expect(inductorEnergyJ(0.006, i)).toBeCloseTo(0.027, 10);
  });
  it('reaches 95 % of the final current at 3 time constants', () => {
    const tau = 0.006 / 4;
    expect(chargeCurrentA(3, tau, 3 * tau) / 3).toBeCloseTo(0.9502, 4);
  });
  it('takes -tau ln(1 - I / I_final) to reach a current: 3 tau to 95.02 %, tau ln 2 to half', () => {
    // The RL step solved for t (hand arithmetic): t = -tau ln(1 - I / I_final).
    const tau = 0.006 / 4;
    expect(timeToReachS(3, tau, 3 * 0.950213)).toBeCloseTo(-tau * Math.log(1 - 0.950213), 12);
    expect(timeToReachS(3, tau, 3 * 0.950213) / tau).toBeCloseTo(3, 5);
    expect(timeToReachS(3, tau, 1.5)).toBeCloseTo(tau * Math.LN2, 12);
    expect(timeToReachS(3, tau, 3)).toBe(Infinity);
  });
});

describe('Alexander & Sadiku, Example 8.16 (series RLC: 12 V, 4 ohm, 8 mH, 1 uF), on the damping law the checker runs', () => {
  // Worked by hand: alpha = R / 2L = 250 /s; omega_d = sqrt(1 / LC - alpha^2) = 1.118e4 rad/s; the
  // first extreme of e^(-alpha t) sin(omega_d t) is at t* = atan(omega_d / alpha) / omega_d, about
  // 139 us, and its size is the lossless i0 sqrt(L / C) times e^(-alpha t*): about 259 V for 3 A.
  // The checker's secondaryDampingFactor (prepare.ts uses it for every inductive peak) is that
  // factor e^(-alpha t*) of the same source-free series RLC.
  const alpha = 4 / (2 * 0.008);
  const wd = Math.sqrt(1 / (0.008 * 1e-6) - alpha * alpha);
  const tPeak = Math.atan(wd / alpha) / wd;
  it('has alpha 250 /s and omega_d 1.118e4 rad/s (the published figures, from the hand arithmetic)', () => {
    expect(alpha).toBe(250);
    expect(wd / 1e4).toBeCloseTo(1.118, 3);
    expect(tPeak * 1e6).toBeGreaterThan(137.5);
    expect(tPeak * 1e6).toBeLessThan(140);
  });
  it('reaches its first primary peak of about 259 V (3 A at opening), by the checker\'s damping factor', () => {
    const f = secondaryDampingFactor(4, 0.008, 1e-6);
    expect(f).toBeCloseTo(Math.exp(-alpha * tPeak), 12);
    const peak = 3 * Math.sqrt(0.008 / 1e-6) * f;
    expect(peak).toBeGreaterThan(257);
    expect(peak).toBeLessThan(261);
  });
});

describe('composite dwell checks (closed form of the RL charge; L 8 mH, R 3 ohm, 13.5 V)', () => {
  // Recomputed from i = V/R (1 - exp(-t R / L)), t = dwellDeg x cyl / 360 x 120 / (rpm x cyl):
  // all three figures in the design note agree with the closed form to the digits printed.
  const cases = [
    { cyl: 4, deg: 52, rpm: 3000, ms: 5.78, a: 3.98, mj: 63.5 },
    { cyl: 6, deg: 38, rpm: 4000, ms: 3.17, a: 3.13, mj: 39.1 },
    { cyl: 8, deg: 30, rpm: 5000, ms: 2.0, a: 2.37, mj: 22.6 },
  ];
  for (const c of cases) {
    it(`gives ${c.ms} ms, ${c.a} A, ${c.mj} mJ for ${c.cyl} cylinders, ${c.deg} deg, ${c.rpm} rpm`, () => {
      const t = dwellFractionFromAngle(c.deg, c.cyl) / sparkRateHz(c.rpm, c.cyl, 'four-stroke');
      const i = chargeCurrentA(13.5 / 3, 0.008 / 3, t);
      expect(t * 1000).toBeCloseTo(c.ms, 2);
      expect(i).toBeCloseTo(c.a, 2);
      expect(inductorEnergyJ(0.008, i) * 1000).toBeCloseTo(c.mj, 1);
    });
  }
});

describe('Heywood 1988, sec. 2.2: slider-crank volume (r_c 8, l/a 3.5)', () => {
  it('gives V/Vc 1 at TDC and 8 at BDC', () => {
    expect(volumeRatioAtAngle(8, 3.5, 0)).toBeCloseTo(1, 10);
    expect(volumeRatioAtAngle(8, 3.5, 180)).toBeCloseTo(8, 10);
  });
  it('gives 5.011 at 90 deg and 1.5946 at 30 deg', () => {
    expect(volumeRatioAtAngle(8, 3.5, 90)).toBeCloseTo(5.011, 3);
    expect(volumeRatioAtAngle(8, 3.5, 30)).toBeCloseTo(1.5946, 4);
  });
});

describe('annealed copper (IACS, alpha 0.00393 /K)', () => {
  it('gives R(80 degC)/R(20 degC) = 1.2358, as (234.5 + 80)/(234.5 + 20)', () => {
    expect(copperResistanceOhm(1, 80)).toBeCloseTo(1.2358, 4);
    expect((234.5 + 80) / (234.5 + 20)).toBeCloseTo(copperResistanceOhm(1, 80), 3);
  });
});

describe('breakdown of air', () => {
  it('gives 30.3 kV for 1 cm at 1 atm (published uniform-field value about 30 kV)', () => {
    const v = airBreakdownV(reducedGapCm(0.01, 101_325, 293));
    expect(v / 1000).toBeCloseTo(30.3, 1);
    expect(Math.abs(v - 30_000) / 30_000).toBeLessThan(0.03);
  });
  it('gives 4.34 kV for 1 mm at 1 atm', () => {
    expect(airBreakdownV(reducedGapCm(0.001, 101_325, 293)) / 1000).toBeCloseTo(4.34, 2);
  });
  it('Paschen (A 15, B 365, gamma 0.01) gives B pd / (ln(A pd) - ln ln(1 + 1/gamma)) at 1 cm, 1 atm: about 35.5 kV', () => {
    // Paschen's law by hand at pd = 760 Torr cm: 365 x 760 / (ln(15 x 760) - ln ln 101) = 35 509 V.
    const byHand = (365 * 760) / (Math.log(15 * 760) - Math.log(Math.log(101)));
    expect(byHand).toBeGreaterThan(35_500);
    expect(byHand).toBeLessThan(35_520);
    expect(paschenBreakdownFromReducedV(1) / byHand).toBeCloseTo(1, 12);
    // The same law on the density-reduced gap: 1 mm at 2 atm is 0.2 cm reduced, pd = 152 Torr cm.
    const twoAtm = (365 * 152) / (Math.log(15 * 152) - Math.log(Math.log(101)));
    expect(paschenBreakdownFromReducedV(reducedGapCm(0.001, 2 * 101_325, 293)) / twoAtm).toBeCloseTo(1, 12);
  });
  it('Paschen reads about 17 % high against the empirical 24.22 x + 6.08 sqrt(x) kV at 1 cm, 1 atm', () => {
    // By hand: 35 509 V against (24.22 + 6.08) kV = 30 300 V, a ratio of 1.172.
    const ratio = (365 * 760) / (Math.log(15 * 760) - Math.log(Math.log(101))) / 30_300;
    expect(ratio).toBeGreaterThan(1.16);
    expect(ratio).toBeLessThan(1.18);
    expect(paschenBreakdownFromReducedV(1) / airBreakdownV(1)).toBeCloseTo(ratio, 9);
  });
});

describe('composite compression and breakdown (Heywood 1988 slider-crank, n 1.3 from memory)', () => {
  it('gives 8.14 bar, 535 K and about 10.8 kV at 0.7 mm for r_c 8, l/a 3.5, 30 deg BTDC, 1 bar, 330 K', () => {
    const v1OverV = 8 / volumeRatioAtAngle(8, 3.5, 30);
    const s = compressInto({ pressurePa: 0, temperatureK: 0 }, 1e5, 330, v1OverV);
    expect(s.pressurePa / 1e5).toBeCloseTo(8.14, 2);
    expect(s.temperatureK).toBeCloseTo(535, 0);
    expect(airBreakdownV(reducedGapCm(0.7e-3, s.pressurePa, s.temperatureK)) / 1000).toBeCloseTo(10.8, 1);
  });
});

describe('battery load-test criterion (workshop manuals)', () => {
  it('gives 9.6 / 9.4 / 9.1 / 8.7 / 8.5 V at 21 / 10 / -1 / -12 / -18 degC', () => {
    expect(crankingFloorV(21)).toBeCloseTo(9.6, 6);
    expect(crankingFloorV(10)).toBeCloseTo(9.4, 6);
    expect(crankingFloorV(-1)).toBeCloseTo(9.1, 6);
    expect(crankingFloorV(-12)).toBeCloseTo(8.7, 6);
    expect(crankingFloorV(-18)).toBeCloseTo(8.5, 6);
  });
});

describe('capacitor energy and CD transfer', () => {
  it('stores 80 mJ in 1 uF at 400 V (0.5 C V^2)', () => {
    expect(capacitorEnergyJ(1e-6, 400)).toBeCloseTo(0.08, 10);
  });
  it('stores 320 times the 0.25 mJ minimum ignition energy of propane-air (NFPA 497)', () => {
    // 0.5 x 1e-6 x 400^2 = 0.08 J; 0.08 / 0.25e-3 = 320.
    expect(capacitorEnergyJ(1e-6, 400) / 0.25e-3).toBeCloseTo(320, 9);
    expect(capacitorEnergyJ(0.5e-6, 300)).toBeCloseTo(0.5 * 0.5e-6 * 300 * 300, 15);
  });
  it('passes the full charge voltage when the reflected capacitance equals C: 2 C V / (C + n^2 Cs) = V (lossless charge sharing)', () => {
    expect(cdSecondaryPeakV(1e-6, 400, 100, 1e-10, 1)).toBeCloseTo(400 * 100, 6);
  });
});

describe('ngspice reference point in ngspice-notes (measured with ngspice 39)', () => {
  it('gives about 34.9 kV lossless for 4 A, Lp 8 mH, n 100, 80 pF secondary, 0.25 uF condenser (ngspice -35.0 kV)', () => {
    const vpa = voltsPerAmp(0.008, effectiveSecondaryCapacitanceF(80e-12, 0.25e-6, 100));
    const v = availableSecondaryV(4, vpa, 1, Infinity);
    expect(v / 1000).toBeCloseTo(34.9, 1);
    expect(Math.abs(v - 35_000) / 35_000).toBeLessThan(0.01);
  });
});

describe('CD transfer through the leakage inductance (series RLC step response)', () => {
  // Peak overshoot of an underdamped second-order step response, exp(-pi zeta / sqrt(1 - zeta^2)):
  // the tabulated 16.3 % at zeta 0.5, 9.5 % at 0.6, 4.6 % at 0.7 (Ogata, Modern Control
  // Engineering, sec. 5-3; Nise, Control Systems Engineering, sec. 4.6).
  it('overshoots 16.3 %, 9.5 % and 4.6 % at zeta 0.5, 0.6 and 0.7', () => {
    expect(cdOvershootFraction(0.5)).toBeCloseTo(0.163, 3);
    expect(cdOvershootFraction(0.6)).toBeCloseTo(0.095, 3);
    expect(cdOvershootFraction(0.7)).toBeCloseTo(0.046, 3);
  });
  it('does not overshoot at or above critical damping, and tends to 0 as zeta rises to 1', () => {
    expect(cdOvershootFraction(1)).toBe(0);
    expect(cdOvershootFraction(3)).toBe(0);
    expect(cdOvershootFraction(0.999)).toBeLessThan(1e-20);
  });
  it('recovers the lossless charge sharing 2 C V / (C + n^2 Cs) as the loop resistance goes to zero (zeta -> 0)', () => {
    const lossless = (100 * 2 * 1e-6 * 400) / (1e-6 + 100 * 100 * 70e-12);
    expect(cdSecondaryPeakV(1e-6, 400, 100, 70e-12, 1, { loopOhm: 0, leakageH: 80e-6 })).toBeCloseTo(lossless, 6);
    expect(cdSecondaryPeakV(1e-6, 400, 100, 70e-12, 1, { loopOhm: 1e-9, leakageH: 80e-6 }) / lossless).toBeCloseTo(1, 8);
    expect(cdSecondaryPeakV(1e-6, 400, 100, 70e-12, 1) / lossless).toBeCloseTo(1, 12);
  });
  it('settles at the charge-sharing value n C V / (C + n^2 Cs) without leakage (an RC loop cannot overshoot)', () => {
    expect(cdSecondaryPeakV(1e-6, 400, 100, 70e-12, 1, { loopOhm: 4, leakageH: 0 })).toBeCloseTo((100 * 1e-6 * 400) / 1.7e-6, 6);
  });
  it('gives 38.45 kV for 1 uF at 400 V, n 100, 70 pF, Lp 8 mH, k 0.995, 2 ohm primary and 20 kohm secondary (worked by hand)', () => {
    // Leakage 2 (1 - k) Lp = 80 uH; n^2 Cs = 0.7 uF; V_cm = 400 / 1.7 = 235.29 V; C_ser = 0.41176 uF;
    // R = 2 + 20 000 / 100^2 = 4 ohm; zeta = 2 sqrt(0.41176e-6 / 80e-6) = 0.14349;
    // overshoot exp(-pi 0.14349 / sqrt(1 - 0.14349^2)) = 0.63414; peak 100 x 235.29 x 1.63414 = 38 450 V.
    const leak = leakageInductanceH(8e-3, 0.995);
    expect(leak).toBeCloseTo(80e-6, 12);
    const loop = { loopOhm: 2 + 20_000 / 100 ** 2, leakageH: leak };
    expect(cdTransferDampingRatio(1e-6, 100, 70e-12, loop)).toBeCloseTo(0.14349, 5);
    expect(cdSecondaryPeakV(1e-6, 400, 100, 70e-12, 1, loop)).toBeCloseTo(38_450.3, 0);
    // The efficiency multiplies once (the losses the loop does not draw).
    expect(cdSecondaryPeakV(1e-6, 400, 100, 70e-12, 0.8, loop)).toBeCloseTo(0.8 * 38_450.3, 0);
  });
});

describe('fouled plug loading the dwell (Thevenin equivalent seen by the primary inductance)', () => {
  it('reflects the shunt and secondary resistance through n^2', () => {
    expect(reflectedShuntOhm(492_000, 8_000, 100)).toBeCloseTo(50, 12);
  });
  it('gives 2.113 A against the clean 2.212 A for 14 V, 4 ohm, 8 mH, 2 ms dwell, 500 kohm shunt at n 100 (worked by hand)', () => {
    // R_sh = 500 000 / 100^2 = 50 ohm; tau = 2 ms; tau_f = 2 ms x (1 + 4 / 50) = 2.16 ms;
    // I_final = 3.5 A unchanged (at DC the inductance shorts the shunt); 3.5 (1 - e^(-2 / 2.16)) = 2.1134 A.
    const tauF = fouledChargeTauS(2e-3, 4, 50);
    expect(tauF).toBeCloseTo(2.16e-3, 12);
    expect(fouledFluxCurrentA(3.5, tauF, 2e-3, Infinity, Infinity, 8e-3 / 50)).toBeCloseTo(2.11342, 5);
    expect(chargeCurrentA(3.5, 2e-3, 2e-3)).toBeCloseTo(2.21242, 5);
  });
  it('recovers the clean break current i_break as the shunt goes to infinity, with and without a current limit', () => {
    const tau = 8e-3 / 4;
    for (const [dwell, limit] of [[2e-3, Infinity], [2e-3, 3], [0.5e-3, 3], [6e-3, 3]] as const) {
      const rsh = Infinity;
      const tauF = fouledChargeTauS(tau, 4, rsh);
      const toLimit = fouledTimeToLimitS(3.5, tauF, 4, rsh, limit);
      // The clean RL charge by hand: t = -tau ln(1 - I_lim / I_final) (no limit: never), i = min(I_final (1 - e^(-t/tau)), I_lim).
      const cleanToLimit = limit < 3.5 ? -tau * Math.log(1 - limit / 3.5) : Infinity;
      if (cleanToLimit === Infinity) expect(toLimit).toBe(Infinity);
      else expect(toLimit).toBeCloseTo(cleanToLimit, 12);
      expect(fouledFluxCurrentA(3.5, tauF, dwell, limit, toLimit, 8e-3 / rsh)).toBeCloseTo(Math.min(3.5 * (1 - Math.exp(-dwell / tau)), limit), 12);
    }
  });
  it('matches the two-branch circuit integrated step by step (KVL round the loop, KCL at the coil), limiter included', () => {
    // Primary: V' through R into Lp in parallel with R_sh; a limiter holds the total primary current
    // at I_lim. Total current i_p = min((V' + R_sh i_f) / (R + R_sh), I_lim); Lp di_f/dt = R_sh (i_p - i_f).
    const v = 14, r = 4, lp = 8e-3, rsh = 50;
    // 2.7 ms at 2.5 A is just past the limiter taking over (2.54 ms), where the flux current still trails the limit.
    for (const [dwell, limit] of [[2e-3, Infinity], [4e-3, 3], [1e-3, 2.5], [2.7e-3, 2.5], [3e-3, 0.2]] as const) {
      const f = (i: number): number => (rsh * (Math.min((v + rsh * i) / (r + rsh), limit) - i)) / lp;
      const steps = 40_000;
      const h = dwell / steps;
      let i = 0;
      for (let k = 0; k < steps; k++) {
        const k1 = f(i), k2 = f(i + 0.5 * h * k1), k3 = f(i + 0.5 * h * k2), k4 = f(i + h * k3);
        i += (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
      }
      const tauF = fouledChargeTauS(lp / r, r, rsh);
      const got = fouledFluxCurrentA(v / r, tauF, dwell, limit, fouledTimeToLimitS(v / r, tauF, r, rsh, limit), lp / rsh);
      expect(Math.abs(got - i), `dwell ${dwell}, limit ${limit}: ${got} against ${i}`).toBeLessThan(1e-5);
    }
  });
});
