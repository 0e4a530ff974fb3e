/**
 * The secondary ring and spark (secondary.ts), the capacitive-discharge transfer (cd.ts), the fouled
 * plug (fouled.ts) and the cranking path (cranking.ts), held at their branches and guard edges.
 * Written against the mutation-testing survivors and the branches no test reached (npm run mutate).
 *
 * Sources: the source-free series and parallel RLC natural response, overdamped
 * s1,2 = -alpha +- sqrt(alpha^2 - w0^2) with the capacitor voltage (I0 / (C (s1 - s2)))(e^(s1 t) - e^(s2 t)),
 * critically damped (I0 / C) t e^(-alpha t), underdamped (I0 / (C wd)) e^(-alpha t) sin(wd t)
 * (Nilsson & Riedel, Electric Circuits, ch. 8, natural response of series and parallel RLC;
 * Alexander & Sadiku, Fundamentals of Electric Circuits, ch. 8); the peak found again by a
 * golden-section search over v(t), a method independent of the peak-time formula; an inductor
 * discharging into a fixed counter-voltage, L di/dt = -V_arc - R i (any circuits text; with R = 0
 * it lasts L I0 / V_arc); the roots of L s^2 + R s + 1/C = 0 for the overdamped CD loop (quadratic
 * formula); the Mercator series of ln(1 + x); Ohm's law and series resistances; the energy
 * 0.5 C V^2 of a capacitor.
 */
import { describe, expect, it } from 'vitest';
import {
  availableSecondaryV,
  inductiveSparkDurationS,
  inductiveSparkEnergyGivenDurationJ,
  inductiveSparkEnergyJ,
  secondaryDampingFactor,
  secondaryRiseTimeS,
  turnsRatio,
} from '../../electron/checker/secondary.js';
import {
  cdChargeVoltageV,
  cdEnergyFallsFromRpm,
  cdOvershootFraction,
  cdRiseTimeS,
  cdSparkEnergyJ,
  cdTransferDampingRatio,
  rechargeTimeS,
} from '../../electron/checker/cd.js';
import { cdFouledFraction, fouledFluxCurrentA, fouledTimeToLimitS, parallelRlcPeakVPerA } from '../../electron/checker/fouled.js';
import { crankingPath, crankingSupplyOf, withCrankingBypass } from '../../electron/checker/cranking.js';
import { prepareSetup } from '../../electron/checker/prepare.js';
import { createSession } from '../../electron/checker/session.js';
import type { ResolvedConditions } from '../../electron/checker/types.js';
import { cdModule, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

/** Relative closeness: |got / want - 1| below 10^-digits. */
function expectRel(got: number, want: number, digits: number): void {
  expect(Number.isFinite(got)).toBe(true);
  expect(Math.abs(got / want - 1)).toBeLessThan(10 ** -digits);
}

/** Golden-section search for the maximum of a unimodal f on [a, b]. */
function maxByGoldenSection(f: (t: number) => number, a: number, b: number): number {
  const g = (Math.sqrt(5) - 1) / 2;
  let lo = a;
  let hi = b;
  for (let k = 0; k < 200; k++) {
    const c = hi - g * (hi - lo);
    const d = lo + g * (hi - lo);
    if (f(c) > f(d)) hi = d;
    else lo = c;
  }
  return f(0.5 * (lo + hi));
}

describe('secondary ring past critical damping (Nilsson & Riedel, series RLC natural response)', () => {
  // A 20 H secondary with 50 pF: lossless peak per ampere sqrt(L/C); critical at Rs = 2 sqrt(L/C).
  const L = 20;
  const C = 50e-12;
  const w0 = 1 / Math.sqrt(L * C);
  it('overdamped: the peak of the two exponentials, at t* = ln(s2/s1)/(s1 - s2), over the lossless peak', () => {
    const rs = 5e6; // about four times critical
    const alpha = rs / (2 * L);
    expect(alpha).toBeGreaterThan(w0);
    const root = Math.sqrt(alpha * alpha - w0 * w0);
    const s1 = -alpha + root;
    const s2 = -alpha - root;
    // v(t) per ampere of I0 = (e^(s1 t) - e^(s2 t)) / (C (s1 - s2)); lossless peak per ampere 1 / (C w0).
    const v = (t: number): number => (Math.exp(s1 * t) - Math.exp(s2 * t)) / (C * (s1 - s2));
    const tPeak = Math.log(s2 / s1) / (s1 - s2);
    const expected = v(tPeak) * C * w0;
    expectRel(secondaryDampingFactor(rs, L, C), expected, 12);
    // The same peak found by searching v(t) itself, not through the peak-time formula.
    expectRel(secondaryDampingFactor(rs, L, C), maxByGoldenSection(v, 0, 20 / -s1) * C * w0, 9);
    expect(secondaryDampingFactor(rs, L, C)).toBeLessThan(Math.exp(-1));
  });
  it('critically damped: (I0 / C) t e^(-alpha t) peaks at t = 1/alpha, I0 / (C alpha e), over I0 / (C w0)', () => {
    const rs = 2 * Math.sqrt(L / C);
    const alpha = rs / (2 * L);
    expectRel(secondaryDampingFactor(rs, L, C), w0 / (alpha * Math.E), 12);
    expect(secondaryDampingFactor(rs, L, C)).toBeCloseTo(Math.exp(-1), 9);
    const v = (t: number): number => t * Math.exp(-alpha * t) / C;
    expectRel(secondaryDampingFactor(rs, L, C), maxByGoldenSection(v, 0, 20 / alpha) * C * w0, 9);
  });
  it('within 1e-6 of critical the critical form stands, on both sides', () => {
    for (const rel of [5e-7, -5e-7]) {
      const alpha = w0 * (1 - rel);
      const rs = 2 * L * alpha;
      const a = rs / (2 * L);
      expectRel(secondaryDampingFactor(rs, L, C), w0 / (a * Math.E), 12);
    }
  });
  it('the band edges themselves: rel = (w0 - alpha)/w0 = +1e-6 takes the critical form, -1e-6 the overdamped', () => {
    // (L, C, Rs) found by search so that rel computes to exactly +-1e-6 in doubles.
    const up = { L: 1.0141488, C: 1, R: 2.0140970897187795 };
    const w1 = 1 / Math.sqrt(up.L * up.C);
    const a1 = up.R / (2 * up.L);
    expect((w1 - a1) / w1).toBe(1e-6);
    expectRel(secondaryDampingFactor(up.R, up.L, up.C), w1 / (a1 * Math.E), 12);
    const down = { L: 1.1837324, C: 1, R: 2.1759915141985124 };
    const w2 = 1 / Math.sqrt(down.L * down.C);
    const a2 = down.R / (2 * down.L);
    expect((w2 - a2) / w2).toBe(-1e-6);
    const root = Math.sqrt(a2 * a2 - w2 * w2);
    const s1 = -a2 + root;
    const s2 = -a2 - root;
    const t = Math.log(s2 / s1) / (s1 - s2);
    expectRel(secondaryDampingFactor(down.R, down.L, down.C), (w2 * (Math.exp(s1 * t) - Math.exp(s2 * t))) / (s1 - s2), 12);
  });
  it('underdamped with w0 far from 1 s^-1: e^(-alpha t*), t* = atan(wd / alpha) / wd', () => {
    // L = C = 1e6 (a scaled circuit): w0 = 1e-6 s^-1, alpha = w0 / 2, wd = w0 sqrt(3)/2.
    const l = 1e6;
    const c = 1e6;
    const w = 1 / Math.sqrt(l * c);
    const alpha = w / 2;
    const rs = 2 * l * alpha;
    const wd = Math.sqrt(w * w - alpha * alpha);
    const expected = Math.exp((-alpha * Math.atan(wd / alpha)) / wd); // = e^(-pi / (3 sqrt 3))
    expect(expected).toBeCloseTo(Math.exp(-Math.PI / (3 * Math.sqrt(3))), 12);
    expectRel(secondaryDampingFactor(rs, l, c), expected, 12);
  });
  it('no resistance, inductance or capacitance: factor 1; a negative resistance is not a gain', () => {
    expect(secondaryDampingFactor(0, L, C)).toBe(1);
    expect(secondaryDampingFactor(1e5, 0, C)).toBe(1);
    expect(secondaryDampingFactor(1e5, L, 0)).toBe(1);
    expect(secondaryDampingFactor(-1e5, L, C)).toBe(1);
  });
});

describe('inductive spark duration: L di/dt = -V_arc - R i from I0 to zero', () => {
  it('without series resistance the current falls linearly and lasts L I0 / V_arc', () => {
    // 20 H, 40 mA, 1000 V arc: 0.8 ms.
    expect(inductiveSparkDurationS(20, 0, 0.04, 1000)).toBeCloseTo((20 * 0.04) / 1000, 15);
  });
  it('a resistance at or below 1e-9 ohm counts as none (the guard\'s edge)', () => {
    // x = R I0 / V = 1 here, where the logarithmic form would give ln 2 of the linear one.
    expect(inductiveSparkDurationS(20, 1e-9, 1e6, 1e-3)).toBeCloseTo((20 * 1e6) / 1e-3, 3);
  });
  it('with resistance: t = (L/R) ln(1 + R I0 / V_arc)', () => {
    const t = (20 / 10e3) * Math.log(1 + (10e3 * 0.04) / 1000);
    expectRel(inductiveSparkDurationS(20, 10e3, 0.04, 1000), t, 13);
  });
  it('no current, no arc voltage, or a negative current: no spark time', () => {
    expect(inductiveSparkDurationS(20, 10e3, 0, 1000)).toBe(0);
    expect(inductiveSparkDurationS(Infinity, 10e3, 0, 1000)).toBe(0);
    expect(inductiveSparkDurationS(20, 10e3, 0.04, 0)).toBe(0);
    expect(inductiveSparkDurationS(20, 0, -0.04, 1000)).toBe(0);
  });
});

describe('inductive spark energy: V_arc times the integral of i, (V^2 L / R^2)(x - ln(1 + x))', () => {
  const L = 20;
  const V = 1000;
  /** x - ln(1 + x) by the Mercator series, summed to double precision (|x| < 1). */
  const xMinusLog1p = (x: number): number => {
    let s = 0;
    let p = x * x;
    for (let k = 2; k < 60; k++) {
      s += ((k % 2 === 0 ? 1 : -1) * p) / k;
      p *= x;
    }
    return s;
  };
  const energy = (r: number, i0: number): number => ((V * V * L) / (r * r)) * xMinusLog1p((r * i0) / V);
  it('just below x = 0.01 the series form matches the Mercator series to 1e-10', () => {
    const r = 900;
    const i0 = 0.01; // x = 0.009
    expectRel(inductiveSparkEnergyJ(L, r, i0, V), energy(r, i0), 10);
  });
  it('at x = 1e-9 the result keeps its digits (x - ln(1+x) would lose them)', () => {
    const r = 1e-4;
    const i0 = 0.01; // x = 1e-9
    expectRel(inductiveSparkEnergyJ(L, r, i0, V), energy(r, i0), 10);
  });
  it('at x = 1e-9 with the duration known the result still keeps its digits (L I0 - V T would not)', () => {
    const r = 1e-4;
    const i0 = 0.01;
    const T = (L / r) * Math.log1p((r * i0) / V);
    expectRel(inductiveSparkEnergyGivenDurationJ(L, r, i0, V, T), energy(r, i0), 10);
  });
  it('at x = 0.01 exactly, without a duration, to 1e-12', () => {
    const r = 1;
    const i0 = 10; // x = 0.01
    expectRel(inductiveSparkEnergyJ(L, r, i0, 1000), energy(r, i0), 12);
  });
  it('at x = 0.01 exactly with the duration known, E = (V/R)(L I0 - V T), to 1e-12', () => {
    const r = 1;
    const i0 = 10;
    const T = (L / r) * Math.log1p((r * i0) / V);
    expectRel(inductiveSparkEnergyGivenDurationJ(L, r, i0, V, T), energy(r, i0), 12);
  });
  it('at x = 10 with the duration known (where a truncated series would be far off)', () => {
    const r = 1e5;
    const i0 = 0.1;
    const x = (r * i0) / V;
    const T = (L / r) * Math.log1p(x);
    const e = ((V * V * L) / (r * r)) * (x - Math.log1p(x));
    expectRel(inductiveSparkEnergyGivenDurationJ(L, r, i0, V, T), e, 12);
    expectRel(inductiveSparkEnergyJ(L, r, i0, V), e, 12);
  });
  it('without resistance all of 0.5 L I0^2 reaches the arc; nothing without current or arc voltage', () => {
    expect(inductiveSparkEnergyJ(L, 0, 0.04, V)).toBeCloseTo(0.5 * L * 0.04 * 0.04, 15);
    expect(inductiveSparkEnergyJ(L, 1e4, 0, V)).toBe(0);
    expect(inductiveSparkEnergyJ(Infinity, 0, 0, V)).toBe(0);
    expect(inductiveSparkEnergyJ(L, 1e4, 0.04, 0)).toBe(0);
    expect(inductiveSparkEnergyJ(L, 0, -0.04, V)).toBe(0);
  });
});

describe('turns ratio, available voltage and rise time', () => {
  it('n when given and positive, else sqrt(Ls / Lp), else 100', () => {
    expect(turnsRatio(80, 20, 0.005)).toBe(80);
    expectRel(turnsRatio(0, 20, 0.005), Math.sqrt(20 / 0.005), 14);
    expectRel(turnsRatio(null, 20, 0.005), Math.sqrt(4000), 14);
    expect(turnsRatio(null, 0, 0.005)).toBe(100);
    expect(turnsRatio(null, 20, 0)).toBe(100);
    expect(turnsRatio(null, null, 0.005)).toBe(100);
  });
  it('V = i sqrt(Lp/C) times the efficiency, capped', () => {
    expect(availableSecondaryV(5, 4000, 0.8, 1e6)).toBeCloseTo(5 * 4000 * 0.8, 9);
    expect(availableSecondaryV(5, 4000, 0.8, 12000)).toBe(12000);
  });
  it('a quarter period of Ls with C: (pi/2) sqrt(Ls C)', () => {
    expect(secondaryRiseTimeS(20, 50e-12)).toBeCloseTo((Math.PI / 2) * Math.sqrt(1e-9), 15);
    expect(secondaryRiseTimeS(20, -50e-12)).toBe(0);
  });
});

describe('CD transfer loop: rise time past critical and without leakage', () => {
  // 1 uF into n^2 Cs = 100^2 x 50 pF = 0.5 uF: C_ser = 1/3 uF; leakage 2 (1 - 0.95) 8 mH = 0.8 mH.
  const C = 1e-6;
  const n = 100;
  const cs = 50e-12;
  const cSer = (C * n * n * cs) / (C + n * n * cs);
  const Lk = 2 * (1 - 0.95) * 0.008;
  it('overdamped: three time constants of the slow root of L s^2 + R s + 1/C_ser = 0', () => {
    const R = 500;
    const disc = R * R - (4 * Lk) / cSer;
    expect(disc).toBeGreaterThan(0);
    const slow = (R - Math.sqrt(disc)) / (2 * Lk); // |s| of the root nearer zero
    expectRel(cdRiseTimeS(C, n, cs, { loopOhm: R, leakageH: Lk }), 3 / slow, 9);
  });
  it('far overdamped (zeta about 1e9): the slow root tends to 1 / (R C_ser), so the time to 3 R C_ser', () => {
    // A tiny leakage makes zeta huge; the slow root -(R - sqrt(R^2 - 4 L / C)) / 2L tends to
    // -1 / (R C_ser) (expand the square root), written here without the cancelling difference.
    const R = 500;
    const tinyLk = 1e-21;
    const disc = R * R - (4 * tinyLk) / cSer;
    const slow = (2 / cSer) / (R + Math.sqrt(disc)); // (R - sqrt(disc)) / 2L times (R + sqrt(disc)) / (R + sqrt(disc))
    expectRel(cdRiseTimeS(C, n, cs, { loopOhm: R, leakageH: tinyLk }), 3 / slow, 12);
    expectRel(cdRiseTimeS(C, n, cs, { loopOhm: R, leakageH: tinyLk }), 3 * R * cSer, 9);
  });
  it('underdamped: the peak time pi / wd of the step response (Ogata, second-order peak time)', () => {
    const R = 20;
    const alpha = R / (2 * Lk);
    const wd = Math.sqrt(1 / (Lk * cSer) - alpha * alpha);
    expectRel(cdRiseTimeS(C, n, cs, { loopOhm: R, leakageH: Lk }), Math.PI / wd, 12);
  });
  it('without leakage the loop is an RC: 3 R C_ser', () => {
    expectRel(cdRiseTimeS(C, n, cs, { loopOhm: 40, leakageH: 0 }), 3 * 40 * cSer, 14);
    expect(cdRiseTimeS(C, n, cs, { loopOhm: -40, leakageH: 0 })).toBe(0);
    expect(cdRiseTimeS(C, n, -cs, { loopOhm: 40, leakageH: 0 })).toBe(0);
  });
  it('exactly critical (zeta = 1): no peak, three time constants of the double root, 3 / w0', () => {
    // Powers of two so that zeta is exactly 1: C = n^2 Cs = 2^-20 F, C_ser = 2^-21 F, L = 2^-19 H,
    // zeta = (R/2) sqrt(C_ser / L) = (4/2)(1/2) = 1, w0 = 1 / sqrt(L C_ser) = 2^20 s^-1.
    const c = 2 ** -20;
    const l = 2 ** -19;
    expect(cdTransferDampingRatio(c, 1, c, { loopOhm: 4, leakageH: l })).toBe(1);
    expect(cdRiseTimeS(c, 1, c, { loopOhm: 4, leakageH: l })).toBe(3 * 2 ** -20);
  });
  it('damping ratio: 0 without resistance, Infinity without leakage, (R/2) sqrt(C_ser / L)', () => {
    expectRel(cdTransferDampingRatio(C, n, cs, { loopOhm: 20, leakageH: Lk }), 10 * Math.sqrt(cSer / Lk), 14);
    expect(cdTransferDampingRatio(C, n, cs, { loopOhm: 0, leakageH: 0 })).toBe(0);
    expect(cdTransferDampingRatio(C, n, cs, { loopOhm: -5, leakageH: Lk })).toBe(0);
    expect(cdTransferDampingRatio(C, n, 0, { loopOhm: 20, leakageH: 0 })).toBe(Infinity);
    expect(cdTransferDampingRatio(C, n, cs, { loopOhm: 20, leakageH: -Lk })).toBe(Infinity);
  });
  it('overshoot: full without damping, none for a negative ratio\'s absurd gain', () => {
    expect(cdOvershootFraction(0)).toBe(1);
    expect(cdOvershootFraction(-0.5)).toBe(1);
    expect(cdOvershootFraction(0.5)).toBeCloseTo(Math.exp(-Math.PI * 0.5 / Math.sqrt(0.75)), 14);
  });
});

describe('CD charge, recharge and the rpm where the capacitor stops filling', () => {
  it('0.5 C V^2 / P: 1 uF at 400 V from 40 W refills in 2 ms; rpm = 60 k / (cylinders T)', () => {
    expect(rechargeTimeS(1e-6, 400, 40)).toBeCloseTo((0.5 * 1e-6 * 400 * 400) / 40, 15);
    expect(cdEnergyFallsFromRpm(1e-6, 400, 40, 4, false)).toBeCloseTo((60 * 2) / (4 * 2e-3), 6);
    expect(cdEnergyFallsFromRpm(1e-6, 400, 40, 2, true)).toBeCloseTo(60 / (2 * 2e-3), 6);
  });
  it('no charger power: never refills, so the energy falls from rpm 0', () => {
    expect(rechargeTimeS(1e-6, 400, 0)).toBe(Infinity);
    expect(rechargeTimeS(1e-6, 400, -40)).toBe(Infinity);
    expect(rechargeTimeS(0, 400, 0)).toBe(Infinity);
    expect(cdEnergyFallsFromRpm(1e-6, 400, 0, 4, false)).toBe(0);
  });
  it('nothing to refill: the energy never falls', () => {
    expect(cdEnergyFallsFromRpm(0, 400, 40, 4, false)).toBe(Infinity);
    expect(cdEnergyFallsFromRpm(1e-6, 0, 40, 4, false)).toBe(Infinity);
    expect(cdEnergyFallsFromRpm(-1e-6, 400, 40, 4, false)).toBe(Infinity);
  });
  it('charge voltage: none at the cut-out itself, nominal above the minimum, sqrt(2 P T / C) when short of time', () => {
    expect(cdChargeVoltageV(400, 1e-6, 40, 0.02, 8, 9, 8)).toBe(0);
    expect(cdChargeVoltageV(400, 1e-6, 40, 0.02, 8.5, 9, 8)).toBeCloseTo((400 * 8.5) / 9, 12);
    expect(cdChargeVoltageV(400, 1e-6, 40, 0.02, 12, 9, 8)).toBe(400);
    // At the minimum supply itself the full nominal voltage (not 450 x 9.2 / 9.2, which rounds off it).
    expect(cdChargeVoltageV(450, 1e-6, 40, 0.02, 9.2, 9.2, 8)).toBe(450);
    expect(cdChargeVoltageV(400, 1e-6, 40, 1e-3, 12, 9, 8)).toBeCloseTo(Math.sqrt((2 * 40 * 1e-3) / 1e-6), 10);
    expect(cdChargeVoltageV(400, 1e-6, 40, -1e-3, 12, 9, 8)).toBe(0);
    expect(cdChargeVoltageV(400, 1e-6, Infinity, 0, 12, 9, 8)).toBe(0);
  });
  it('spark energy V_a 2 C (V - V_a): nothing when the charge is below the reflected arc, or no capacitor', () => {
    expect(cdSparkEnergyJ(1e-6, 400, 100, 1000, 0.8)).toBeCloseTo(0.8 * 10 * 2 * 1e-6 * 390, 15);
    expect(cdSparkEnergyJ(1e-6, 5, 100, 1000, 0.8)).toBe(0);
    expect(cdSparkEnergyJ(-1e-6, 400, 100, 1000, 0.8)).toBe(0);
  });
});

describe('fouled plug: parallel RLC peak per ampere (Nilsson & Riedel, parallel RLC natural response)', () => {
  // 20 H with 50 pF: critical shunt R = 0.5 sqrt(L/C).
  const L = 20;
  const C = 50e-12;
  const w0 = 1 / Math.sqrt(L * C);
  it('overdamped: (e^(s1 t*) - e^(s2 t*)) / (C (s1 - s2)), t* = ln(s2/s1)/(s1 - s2)', () => {
    const R = 50e3;
    const alpha = 1 / (2 * R * C);
    expect(alpha).toBeGreaterThan(w0);
    const root = Math.sqrt(alpha * alpha - w0 * w0);
    const s1 = -alpha + root;
    const s2 = -alpha - root;
    const v = (t: number): number => (Math.exp(s1 * t) - Math.exp(s2 * t)) / (C * (s1 - s2));
    expectRel(parallelRlcPeakVPerA(L, C, R), v(Math.log(s2 / s1) / (s1 - s2)), 12);
    expectRel(parallelRlcPeakVPerA(L, C, R), maxByGoldenSection(v, 0, 20 / -s1), 9);
  });
  it('critically damped: 1 / (C alpha e)', () => {
    const R = 0.5 * Math.sqrt(L / C);
    const alpha = 1 / (2 * R * C);
    expectRel(parallelRlcPeakVPerA(L, C, R), 1 / (C * alpha * Math.E), 12);
  });
  it('the band edges themselves: rel = +1e-6 takes the critical form, -1e-6 the overdamped', () => {
    // (L, C, R) found by search so that rel = (w0 - alpha)/w0 computes to exactly +-1e-6 in doubles.
    const up = { L: 1.0141488, C: 1, R: 0.5035252794797502 };
    const w1 = 1 / Math.sqrt(up.L * up.C);
    const a1 = 1 / (2 * up.R * up.C);
    expect((w1 - a1) / w1).toBe(1e-6);
    expectRel(parallelRlcPeakVPerA(up.L, up.C, up.R), 1 / (up.C * a1 * Math.E), 12);
    const down = { L: 1.1817209, C: 1, R: 0.5435343909454454 };
    const w2 = 1 / Math.sqrt(down.L * down.C);
    const a2 = 1 / (2 * down.R * down.C);
    expect((w2 - a2) / w2).toBe(-1e-6);
    const root = Math.sqrt(a2 * a2 - w2 * w2);
    const s1 = -a2 + root;
    const s2 = -a2 - root;
    const t = Math.log(s2 / s1) / (s1 - s2);
    expectRel(parallelRlcPeakVPerA(down.L, down.C, down.R), (Math.exp(s1 * t) - Math.exp(s2 * t)) / (down.C * (s1 - s2)), 12);
  });
  it('underdamped with w0 far from 1 s^-1: sqrt(L/C) e^(-alpha t*)', () => {
    const l = 1e6;
    const c = 1e6;
    const w = 1 / Math.sqrt(l * c);
    const alpha = w / 2;
    const R = 1 / (2 * alpha * c);
    const wd = Math.sqrt(w * w - alpha * alpha);
    expectRel(parallelRlcPeakVPerA(l, c, R), Math.sqrt(l / c) * Math.exp((-alpha * Math.atan2(wd, alpha)) / wd), 12);
  });
  it('no inductance, capacitance or shunt: 0; an open shunt gives the lossless sqrt(L/C)', () => {
    expect(parallelRlcPeakVPerA(0, C, 1e5)).toBe(0);
    expect(parallelRlcPeakVPerA(L, 0, 1e5)).toBe(0);
    expect(parallelRlcPeakVPerA(-L, C, 1e5)).toBe(0);
    expect(parallelRlcPeakVPerA(L, C, 0)).toBe(0);
    expect(parallelRlcPeakVPerA(L, C, -1e7)).toBe(0);
    expect(parallelRlcPeakVPerA(L, C, Infinity)).toBe(Math.sqrt(L / C));
  });
});

describe('fouled plug: charging to a limit and CD bleeding', () => {
  it('time to the limit: -tau_f ln((1 - I_lim/I_f)(1 + R/R_sh)), 0 when the shunt alone draws it', () => {
    const t = -2e-3 * Math.log((1 - 5 / 10) * (1 + 1 / 4));
    expectRel(fouledTimeToLimitS(10, 2e-3, 1, 4, 5), t, 14);
    // R = R_sh: the current starts at I_f / 2 = I_lim, exactly at the limit (and +0, not -0).
    expect(fouledTimeToLimitS(10, 2e-3, 1, 1, 5)).toBe(0);
    expect(fouledTimeToLimitS(10, 2e-3, 1, 0.5, 5)).toBe(0);
    expect(fouledTimeToLimitS(10, 2e-3, 1, 4, 10)).toBe(Infinity);
    // A limit at or below zero is held from the start (guard for a drive of the wrong sign).
    expect(fouledTimeToLimitS(-1, 2e-3, 1, 4, -2)).toBe(0);
  });
  it('flux current held at the limit: I_lim - (I_lim - i(t_l)) e^(-(t - t_l)/tau_hold); no hold time, the limit', () => {
    const atLimit = 10 * (1 - Math.exp(-1e-3 / 2e-3));
    expectRel(fouledFluxCurrentA(10, 2e-3, 3e-3, 5, 1e-3, 0.5e-3), 5 - (5 - atLimit) * Math.exp(-4), 14);
    expect(fouledFluxCurrentA(10, 2e-3, 3e-3, 5, 1e-3, 0)).toBe(5);
    expect(fouledFluxCurrentA(10, 2e-3, 3e-3, 5, 1e-3, -0.5e-3)).toBe(5);
  });
  it('CD fraction (tau / t_r)(1 - e^(-t_r / tau)); 1 for an instant rise, 0 without a bleed time constant', () => {
    expectRel(cdFouledFraction(10e-6, 1e5, 50e-12), (5e-6 / 10e-6) * (1 - Math.exp(-2)), 14);
    expect(cdFouledFraction(0, 1e5, 50e-12)).toBe(1);
    expect(cdFouledFraction(-1e-6, 1e5, 50e-12)).toBe(1);
    expect(cdFouledFraction(0, 0, 50e-12)).toBe(0);
  });
});

describe('cranking path: series resistances, Ohm\'s law and the CD charger\'s load', () => {
  const cd = cdModule();
  const tr = module();
  // coil 1.5, harness 0.1, contact 0.05, cold ballast 1.2; 9.6 V cranking; 1.5 V switch drop; 5 mH.
  it('with a ballast and no bypass the cold ballast is in series; I = (V - drop) / R; tau = L / R', () => {
    const p = crankingPath(pointsSetup({ ballast: ironBallast() }), null, 'points', 9.6, 1.5, 0.1, 0.05, 1.2, 0.3, 0.005);
    const r = 1.5 + 0.1 + 0.05 + 1.2;
    expect(p.rCrankingOhm).toBeCloseTo(r, 14);
    expect(p.iFinalCrankingA).toBeCloseTo((9.6 - 0.3) / r, 14);
    expect(p.tauCrankingS).toBeCloseTo(0.005 / r, 15);
    expect(p.moduleSupplyCrankingV).toBeNull();
  });
  it('the bypass takes the ballast out while cranking', () => {
    const p = crankingPath(pointsSetup({ ballast: ironBallast(), crankingBypass: true }), null, 'points', 9.6, 1.5, 0.1, 0.05, 1.2, 0.3, 0.005);
    expect(p.rCrankingOhm).toBeCloseTo(1.65, 14);
  });
  it('a magneto draws no battery current', () => {
    const p = crankingPath(pointsSetup({ switching: 'magneto' }), null, 'magneto', 9.6, 1.5, 0.1, 0.05, 0, 0.3, 0.005);
    expect(p.iFinalCrankingA).toBe(0);
  });
  it('a module fed after the ballast loses the ballast drop too: V - (R_h + R_b) I', () => {
    const s = moduleSetup(tr, { ballast: ironBallast(), moduleFeed: 'after-ballast' });
    const p = crankingPath(s, tr, tr.moduleType, 9.6, 1.5, 0.1, 0.05, 1.2, 1.5, 0.005);
    const i = (9.6 - 1.5) / 2.85;
    expect(p.moduleSupplyCrankingV).toBeCloseTo(9.6 - (0.1 + 1.2) * i, 12);
  });
  it('fed from the switched feed, or after a ballast that is not fitted, only the harness drops', () => {
    const direct = crankingPath(moduleSetup(tr, { ballast: ironBallast() }), tr, tr.moduleType, 9.6, 1.5, 0.1, 0.05, 1.2, 1.5, 0.005);
    expect(direct.moduleSupplyCrankingV).toBeCloseTo(9.6 - 0.1 * ((9.6 - 1.5) / 2.85), 12);
    const none = crankingPath(moduleSetup(tr, { moduleFeed: 'after-ballast' }), tr, tr.moduleType, 9.6, 1.5, 0.1, 0.05, 0.9, 1.5, 0.005);
    expect(none.moduleSupplyCrankingV).toBeCloseTo(9.6 - 0.1 * ((9.6 - 1.5) / 1.65), 12);
  });
  it('a CD charger of power P on feed R: V_m = (V + sqrt(V^2 - 4 R P)) / 2 (V_m = V - R P / V_m)', () => {
    const p = crankingPath(moduleSetup(cd), cd, 'capacitive-discharge', 9.6, 1.5, 0.1, 0.05, 0, 1.5, 0.005);
    const P = cd.cd!.chargerPowerW;
    expect(p.moduleSupplyCrankingV).toBeCloseTo(0.5 * (9.6 + Math.sqrt(9.6 * 9.6 - 4 * 0.1 * P)), 12);
  });
  it('a CD module on a setup described as inductive is treated as an inductive switch: V - R_h I', () => {
    const s = moduleSetup(cd, { switching: 'breakerless-current-limited' });
    const p = crankingPath(s, cd, 'breakerless-current-limited', 9.6, 1.5, 0.1, 0.05, 0, 1.5, 0.005);
    expect(p.moduleSupplyCrankingV).toBeCloseTo(9.6 - 0.1 * ((9.6 - 1.5) / 1.65), 12);
  });
  it('the cranking supply as given, 0 included; 9.6 V when not a usable number', () => {
    const c = (value: number): ResolvedConditions => ({ crankingSupplyV: { value } }) as unknown as ResolvedConditions;
    expect(crankingSupplyOf(c(8.5))).toBe(8.5);
    expect(crankingSupplyOf(c(0))).toBe(0);
    expect(crankingSupplyOf(c(-1))).toBe(9.6);
    expect(crankingSupplyOf(c(Number.NaN))).toBe(9.6);
    expect(crankingSupplyOf(c(Infinity))).toBe(9.6);
  });
});

describe('withCrankingBypass keeps the rest of a prepared setup', () => {
  const s = createSession(fourCylinder, undefined, { rpmPoints: 8 });
  it('a points setup with a module chosen keeps its issue and no module supply', () => {
    const setup = pointsSetup({ module: module(), ballast: ironBallast() });
    const p = prepareSetup(s.engine, setup, s.conditions, s.model);
    expect(p.issues.length).toBeGreaterThan(0);
    const q = withCrankingBypass(p, { ...setup, crankingBypass: true }, s.conditions);
    expect(q.issues).toEqual(p.issues);
    expect(q.moduleSupplyCrankingV).toBeNull();
    expect(q.rCrankingOhm).toBeCloseTo(p.coilColdOhm + p.harnessOhm + p.contactOhm, 12);
  });
  it('a magneto with a module chosen has no module supply', () => {
    const setup = pointsSetup({ switching: 'magneto', module: module() });
    const p = prepareSetup(s.engine, setup, s.conditions, s.model);
    expect(withCrankingBypass(p, { ...setup, crankingBypass: true }, s.conditions).moduleSupplyCrankingV).toBeNull();
  });
  it('a module setup: the module sees V - R_h I with I = (V - drop) / (coil + harness + contact)', () => {
    const setup = moduleSetup(module());
    const p = prepareSetup(s.engine, setup, s.conditions, s.model);
    const q = withCrankingBypass(p, { ...setup, crankingBypass: true }, s.conditions);
    const v = s.conditions.crankingSupplyV.value;
    const i = (v - p.switchDropV) / (p.coilColdOhm + p.harnessOhm + p.contactOhm);
    expect(q.moduleSupplyCrankingV).toBeCloseTo(v - p.harnessOhm * i, 12);
  });
});
