/**
 * The rpm sweep (sweep.ts `evaluateGrid`) on a small grid (12 points), held to the laws it applies
 * point by point and to its documented contracts:
 * - the verdict-only scope gives every column of the full sweep except the fouled-plug peak (NaN),
 *   and with an off-time fail ratio leaves a spark duration out (NaN) only where the off time is at
 *   least the ratio times the longest the spark could last, Ls Is0 / V_arc (SweepScope docs);
 * - the CD branch: no spark at or below the charger's cut-out (no-spark.ts), multi-spark below the
 *   given rpm, charger loss at 70 % efficiency, the clamp and the coil's ceiling;
 * - the inductive branch: supply cases (cranking, running, resting below a dynamo's cut-in), the
 *   RL charge, the current-limited module's heat during the hold, the fouled-plug peak and its cap,
 *   the iron ballast's own equilibrium at each running rpm;
 * - the reserve ratio when the gap needs nothing, the shared required-voltage array, the
 *   cranking-only scope, and that nothing outside the grid's points is written.
 * Parts are the invented ones of fixtures.ts. A fast stand-in for the slow search-equivalence test.
 */
import { describe, expect, it } from 'vitest';
import { airBreakdownV, paschenBreakdownFromReducedV } from '../../electron/checker/breakdown.js';
import { meanSquareCurrentA2 } from '../../electron/checker/charge.js';
import { fouledChargeTauS, fouledFluxCurrentA, fouledTimeToLimitS, reflectedShuntOhm } from '../../electron/checker/fouled.js';
import type { RpmGrid } from '../../electron/checker/grid.js';
import { prepareSetup, type PreparedSetup } from '../../electron/checker/prepare.js';
import { OFF_TIME_FAIL_RATIO } from '../../electron/checker/rules/spark.js';
import { inductiveSparkDurationS } from '../../electron/checker/secondary.js';
import { createSession, type Session } from '../../electron/checker/session.js';
import { createWorkspace, evaluateGrid, type Workspace } from '../../electron/checker/sweep.js';
import { ironBallastResistanceOhm } from '../../electron/checker/thermal.js';
import { dwellTimeS, DwellMode } from '../../electron/checker/timing.js';
import type { SetupSpec } from '../../electron/checker/types.js';
import { ballastCoil, cdModule, coil, fourCylinder, ironBallast, module, moduleSetup, pointsSetup } from './fixtures.js';

const COLUMNS = ['supplyV', 'resistanceOhm', 'dwellS', 'offS', 'currentA', 'energyJ', 'availableV', 'requiredV', 'reserveRatio', 'riseS', 'durationS', 'fouledV', 'cdChargeV', 'multiSpark', 'noSpark', 'moduleW', 'uncappedV', 'ballastK'] as const;

const GAP_M = 0.7e-3;
const session = (engine = fourCylinder, options: Parameters<typeof createSession>[2] = { rpmPoints: 12 }): Session => createSession(engine, undefined, options);
const prep = (s: Session, setup: SetupSpec): PreparedSetup => prepareSetup(s.engine, setup, s.conditions, s.model);
function sweep(p: PreparedSetup, g: RpmGrid, scope?: Parameters<typeof evaluateGrid>[5], required?: Float64Array): Workspace {
  const ws = createWorkspace(g.n);
  evaluateGrid(p, g, GAP_M, ws, required, scope);
  return ws;
}
const rel = (got: number, want: number, tol = 1e-12): void => {
  expect(Math.abs(got - want)).toBeLessThanOrEqual(tol * Math.max(Math.abs(want), 1e-300));
};

/** Current-limited module on a 1.5 ohm coil with an iron ballast (the final current tops the 6 A limit). */
const limitedWithBallast = (): SetupSpec => moduleSetup(module(), { coil: ballastCoil(), ballast: ironBallast() });
const limitedNoBallast = (over = {}): SetupSpec => moduleSetup(module(over), { coil: ballastCoil() });
const fixedDuty = (): SetupSpec =>
  moduleSetup(module({ name: 'Fixed duty', moduleType: 'breakerless-fixed-duty', fixedDutyFraction: 0.6, currentLimitA: null, maxDutyFraction: null }));
/** Near its off-time limit: 90 % maximum duty and a long hold leave a short off time at high rpm. */
const nearOffLimit = (): SetupSpec =>
  moduleSetup(module({ name: 'Long dwell', maxDutyFraction: 0.92, currentLimitA: 7.5 }), { coil: coil({ primaryResistanceOhm20C: { value: 1.2, provenance: 'catalogue' }, primaryInductanceH: 0.012 }) });
const cdSetup = (): SetupSpec => moduleSetup(cdModule());
const setups = (): SetupSpec[] => [pointsSetup(), limitedWithBallast(), fixedDuty(), cdSetup(), nearOffLimit()];

describe('verdict-only sweep against the full sweep (SweepScope.verdictOnly contract)', () => {
  const s = session();
  const g = s.grids.sweep;

  it('gives every column but the fouled peak, which is NaN', () => {
    for (const setup of setups()) {
      const p = prep(s, setup);
      const full = sweep(p, g);
      const verdict = sweep(p, g, { verdictOnly: true });
      for (const k of COLUMNS) {
        if (k === 'fouledV') continue;
        expect(Array.from(verdict[k]), `${setup.label} ${k}`).toEqual(Array.from(full[k]));
      }
      expect(Array.from(verdict.fouledV).every(Number.isNaN), setup.label).toBe(true);
      // The full sweep does fill the fouled peak (a number at every point).
      expect(Array.from(full.fouledV).every(Number.isFinite), setup.label).toBe(true);
    }
  });

  it('with the off-time fail ratio leaves out exactly the durations the documented bound allows', () => {
    let skipped = 0;
    let kept = 0;
    for (const setup of setups()) {
      const p = prep(s, setup);
      const full = sweep(p, g);
      const verdict = sweep(p, g, { verdictOnly: true, offTimeFailRatio: OFF_TIME_FAIL_RATIO });
      for (const k of COLUMNS) {
        if (k === 'fouledV' || k === 'durationS') continue;
        expect(Array.from(verdict[k]), `${setup.label} ${k}`).toEqual(Array.from(full[k]));
      }
      expect(Array.from(verdict.fouledV).every(Number.isNaN), setup.label).toBe(true);
      for (let i = 0; i < g.n; i++) {
        const d = verdict.durationS[i]!;
        const off = full.offS[i]!;
        if (p.mode === DwellMode.Cd) {
          expect(d, `${setup.label} ${i}`).toBe(full.durationS[i]);
          continue;
        }
        // Longest spark: Ls Is0 / V_arc with Is0 = eta i / n (ln(1 + x) <= x; SweepScope.offTimeFailRatio).
        const longest = (p.secondaryInductanceH * p.eta * full.currentA[i]!) / p.n / p.arcV;
        if (Number.isNaN(d)) {
          skipped++;
          // Only where the off time cannot fail: off / duration >= the ratio.
          expect(off / full.durationS[i]!, `${setup.label} ${i}`).toBeGreaterThanOrEqual(OFF_TIME_FAIL_RATIO);
          expect(off, `${setup.label} ${i}`).toBeGreaterThanOrEqual(OFF_TIME_FAIL_RATIO * longest * (1 - 1e-6));
        } else {
          kept++;
          expect(d, `${setup.label} ${i}`).toBe(full.durationS[i]);
          // Documented: where the off time clears the bound with room, the duration is left out.
          expect(off < OFF_TIME_FAIL_RATIO * longest * (1 + 1e-6), `${setup.label} ${i}: off ${off}, bound ${OFF_TIME_FAIL_RATIO * longest}`).toBe(true);
        }
      }
    }
    expect(skipped).toBeGreaterThan(0);
    expect(kept).toBeGreaterThan(0);
  });

  it('the near-limit setup really has points that could fail the off time (off / duration < ratio)', () => {
    const p = prep(s, nearOffLimit());
    const full = sweep(p, g);
    const verdict = sweep(p, g, { verdictOnly: true, offTimeFailRatio: OFF_TIME_FAIL_RATIO });
    let close = 0;
    for (let i = 0; i < g.n; i++) {
      if (full.offS[i]! / full.durationS[i]! < OFF_TIME_FAIL_RATIO) {
        close++;
        expect(verdict.durationS[i]).toBe(full.durationS[i]);
      }
    }
    expect(close).toBeGreaterThan(0);
  });

  it('an off-time ratio without verdictOnly changes nothing (the ratio is read only with verdictOnly)', () => {
    for (const setup of setups()) {
      const p = prep(s, setup);
      const full = sweep(p, g);
      const withRatio = sweep(p, g, { offTimeFailRatio: OFF_TIME_FAIL_RATIO });
      for (const k of COLUMNS) expect(Array.from(withRatio[k]), `${setup.label} ${k}`).toEqual(Array.from(full[k]));
    }
  });
});

describe('CD branch', () => {
  const s = session();
  const g = s.grids.sweep;
  const base = prep(s, cdSetup());
  const cd = base.cd!;
  const modRunning = base.moduleSupplyRunningV ?? base.runningSupplyV;
  const running = (i: number): boolean => g.cranking[i] === 0 && g.resting[i] === 0;

  it('no spark at exactly the cut-out voltage (no-spark.ts: "at or below ... its charger cuts out")', () => {
    const p: PreparedSetup = { ...base, cd: { ...cd, cutOutV: modRunning } };
    const ws = sweep(p, g);
    for (let i = 0; i < g.n; i++) {
      if (!running(i)) continue;
      expect(ws.noSpark[i], `point ${i}`).toBe(1);
      expect(ws.cdChargeV[i]).toBe(0);
      expect(ws.energyJ[i]).toBe(0);
      expect(ws.availableV[i]).toBe(0);
      // No peak: no rise, no spark duration, reserve 0.
      expect(ws.riseS[i]).toBe(0);
      expect(ws.durationS[i]).toBe(0);
      expect(ws.reserveRatio[i]).toBe(0);
      expect(ws.moduleW[i]).toBe(0);
    }
    // Just above the cut-out the charger runs.
    const alive = sweep({ ...base, cd: { ...cd, cutOutV: modRunning * (1 - 1e-9) } }, g);
    for (let i = 0; i < g.n; i++) if (running(i)) {
      expect(alive.noSpark[i]).toBe(0);
      expect(alive.durationS[i]).toBe(cd.sparkDurationS);
      expect(alive.riseS[i]).toBe(cd.riseS);
    }
  });

  it('multi-spark strictly below the given rpm', () => {
    const k = 5;
    const at = g.rpm[k]!;
    const ws = sweep({ ...base, cd: { ...cd, multiSparkBelowRpm: at } }, g);
    for (let i = 0; i < g.n; i++) expect(ws.multiSpark[i], `point ${i}`).toBe(g.rpm[i]! < at ? 1 : 0);
    expect(ws.multiSpark[k]).toBe(0);
    expect(ws.multiSpark[k - 1]).toBe(1);
  });

  it('stored energy 0.5 C V^2 and charger heat = energy / period x 0.3 / 0.7 (70 % efficient charger, from memory)', () => {
    const ws = sweep(base, g);
    for (let i = 0; i < g.n; i++) {
      const v = ws.cdChargeV[i]!;
      expect(v).toBeGreaterThan(0);
      const e = 0.5 * cd.capacitorF * v * v;
      rel(ws.energyJ[i]!, e);
      rel(ws.moduleW[i]!, (e / g.periodS[i]!) * (3 / 7), 1e-9);
    }
  });

  it('the clamp caps the peak (n V_clamp) and the ceiling caps the available voltage, also at equality', () => {
    const raw = (ws: Workspace, i: number): number => (g.cranking[i] === 1 ? cd.peakPerChargeCrankingV : cd.peakPerChargeV) * ws.cdChargeV[i]!;
    const free = sweep({ ...base, clampCapV: Infinity, ceilingV: Infinity }, g);
    const peaks = Array.from({ length: g.n }, (_, i) => raw(free, i));
    const clamp = peaks[g.n - 1]!; // exactly the last point's own peak
    const lowest = Math.min(...peaks);
    const ceiling = (clamp + lowest) / 2;
    const ws = sweep({ ...base, clampCapV: clamp, ceilingV: ceiling }, g);
    let clamped = 0;
    for (let i = 0; i < g.n; i++) {
      const uncapped = Math.min(peaks[i]!, clamp);
      if (peaks[i]! > clamp) clamped++;
      expect(ws.uncappedV[i], `point ${i}`).toBe(uncapped);
      expect(ws.availableV[i], `point ${i}`).toBe(Math.min(uncapped, ceiling));
      expect(ws.reserveRatio[i]).toBe(ws.availableV[i]! / ws.requiredV[i]!);
    }
    expect(clamped).toBeGreaterThan(0);
  });

  it('resting supply below the dynamo cut-in, running above, cranking at cranking (grid.ts resting flag)', () => {
    const sd = session({ ...fourCylinder, charging: 'dynamo' });
    const gd = sd.grids.sweep;
    const p = prep(sd, cdSetup());
    expect(p.restingSupplyV).not.toBe(p.runningSupplyV);
    const ws = sweep(p, gd);
    let resting = 0;
    let run = 0;
    for (let i = 0; i < gd.n; i++) {
      const want = gd.cranking[i] === 1 ? p.crankingSupplyV : gd.resting[i] === 1 ? p.restingSupplyV : p.runningSupplyV;
      if (gd.resting[i] === 1) resting++;
      else if (gd.cranking[i] === 0) run++;
      expect(ws.supplyV[i], `point ${i}`).toBe(want);
    }
    expect(resting).toBeGreaterThan(0);
    expect(run).toBeGreaterThan(0);
  });

  it('crankingOnly recomputes the cranking points only and leaves the rest of the workspace', () => {
    const full = sweep(base, g);
    const ws = createWorkspace(g.n);
    for (const k of COLUMNS) ws[k].fill(7);
    evaluateGrid(base, g, GAP_M, ws, undefined, { crankingOnly: true });
    for (let i = 0; i < g.n; i++) {
      for (const k of COLUMNS) {
        if (k === 'requiredV') continue;
        expect(ws[k][i], `${k} ${i}`).toBe(g.cranking[i] === 1 ? full[k][i] : 7);
      }
    }
  });
});

describe('reserve ratio when the gap needs nothing (sweep.ts reserveRatio: 1e6 if anything is available, else 0)', () => {
  const s = session();
  const g = s.grids.sweep;
  const zeros = new Float64Array(g.n);
  it('inductive and CD with voltage available: 1e6', () => {
    for (const setup of [pointsSetup(), cdSetup()]) {
      const ws = sweep(prep(s, setup), g, undefined, zeros);
      for (let i = 0; i < g.n; i++) {
        expect(ws.availableV[i]).toBeGreaterThan(0);
        expect(ws.reserveRatio[i], `${setup.label} ${i}`).toBe(1e6);
      }
    }
  });
  it('CD with nothing available (charger cut out): 0', () => {
    const p = prep(s, cdSetup());
    const ws = sweep({ ...p, cd: { ...p.cd!, cutOutV: 1000 } }, g, undefined, zeros);
    for (let i = 0; i < g.n; i++) {
      expect(ws.availableV[i]).toBe(0);
      expect(ws.reserveRatio[i], `${i}`).toBe(0);
    }
  });
});

describe('required voltage', () => {
  it('a shared array of the grid\'s length is used as given; one of another length is ignored', () => {
    const s = session();
    const g = s.grids.sweep;
    const p = prep(s, pointsSetup());
    const given = Float64Array.from({ length: g.n }, (_, i) => 5000 + 100 * i);
    const ws = sweep(p, g, undefined, given);
    expect(Array.from(ws.requiredV)).toEqual(Array.from(given));
    for (let i = 0; i < g.n; i++) expect(ws.reserveRatio[i]).toBe(ws.availableV[i]! / given[i]!);
    // Wrong length: worked out from the gap by the breakdown law (breakdown.ts), gap in cm x density factor.
    const short = new Float64Array(g.n - 1).fill(1);
    const ws2 = sweep(p, g, undefined, short);
    for (let i = 0; i < g.n; i++) expect(ws2.requiredV[i]).toBe(airBreakdownV(GAP_M * 100 * g.densityFactor[i]!) * p.polarityFactor);
  });

  it('Paschen model: required voltage from the Paschen law at the reduced gap', () => {
    const s = session(fourCylinder, { rpmPoints: 12, breakdownModel: 'paschen' });
    const g = s.grids.sweep;
    const p = prep(s, pointsSetup());
    expect(p.model).toBe('paschen');
    const ws = sweep(p, g);
    for (let i = 0; i < g.n; i++) expect(ws.requiredV[i]).toBe(paschenBreakdownFromReducedV(GAP_M * 100 * g.densityFactor[i]!) * p.polarityFactor);
  });
});

describe('a workspace longer than the grid', () => {
  it('is written at the grid\'s points only ("fill ws for every point of grid")', () => {
    const s = session();
    const g = s.grids.sweep;
    for (const setup of [pointsSetup(), cdSetup()]) {
      const ws = createWorkspace(g.n + 1);
      evaluateGrid(prep(s, setup), g, GAP_M, ws);
      for (const k of COLUMNS) expect(ws[k][g.n], `${setup.label} ${k}`).toBe(0);
    }
  });
});

/** The grid from point `from` on (its first point is then a running one). */
function tail(g: RpmGrid, from: number): RpmGrid {
  return {
    n: g.n - from,
    rpm: g.rpm.slice(from),
    cranking: g.cranking.slice(from),
    resting: g.resting.slice(from),
    sparkRateHz: g.sparkRateHz.slice(from),
    periodS: g.periodS.slice(from),
    sparkAngleDegBtdc: g.sparkAngleDegBtdc.slice(from),
    pressurePa: g.pressurePa.slice(from),
    temperatureK: g.temperatureK.slice(from),
    densityFactor: g.densityFactor.slice(from),
  };
}

describe('inductive branch', () => {
  const s = session();
  const g = s.grids.sweep;

  it('a grid that starts on a running point gives the same points as the whole grid (point-by-point contract)', () => {
    for (const setup of [pointsSetup(), limitedNoBallast(), fixedDuty()]) {
      const p = prep(s, setup);
      const full = sweep(p, g);
      const t = tail(g, 2);
      const ws = sweep(p, t);
      for (const k of COLUMNS) expect(Array.from(ws[k]), `${setup.label} ${k}`).toEqual(Array.from(full[k]).slice(2));
    }
  });

  it('cranking point on the cranking supply, resistance and time constant; running points on the running ones (RL charge, charge.ts)', () => {
    // A slow coil (Lp 0.2 H): the cranking dwell is then comparable with tau, so tau shows in i.
    for (const setup of [pointsSetup(), pointsSetup({ coil: coil({ primaryInductanceH: 0.2 }) })]) {
      const p = prep(s, setup);
      expect(p.tauCrankingS).not.toBe(p.tauRunningS);
      const ws = sweep(p, g);
      for (let i = 0; i < g.n; i++) {
        const cr = g.cranking[i] === 1;
        expect(ws.supplyV[i]).toBe(cr ? p.crankingSupplyV : p.runningSupplyV);
        expect(ws.resistanceOhm[i]).toBe(cr ? p.rCrankingOhm : p.rRunningOhm);
        // Points: dwell = cam fraction x period (no float); i = I_f (1 - e^(-t/tau)).
        const dwell = p.camFraction * g.periodS[i]!;
        rel(ws.dwellS[i]!, dwell);
        const iF = cr ? p.iFinalCrankingA : p.iFinalRunningA;
        const tau = cr ? p.tauCrankingS : p.tauRunningS;
        rel(ws.currentA[i]!, iF * (1 - Math.exp(-dwell / tau)), 1e-9);
      }
    }
  });

  it('dynamo car: resting points on the resting supply and final current, the module cut out only there', () => {
    const sd = session({ ...fourCylinder, charging: 'dynamo' });
    const gd = sd.grids.sweep;
    // Minimum supply between the module's resting and running supplies.
    const p0 = prep(sd, pointsSetup());
    const ptsWs = sweep(p0, gd);
    let resting = 0;
    for (let i = 0; i < gd.n; i++) {
      if (gd.cranking[i] === 1) continue;
      const r = gd.resting[i] === 1;
      if (r) resting++;
      expect(ptsWs.supplyV[i]).toBe(r ? p0.restingSupplyV : p0.runningSupplyV);
      const dwell = p0.camFraction * gd.periodS[i]!;
      rel(ptsWs.currentA[i]!, (r ? p0.iFinalRestingA : p0.iFinalRunningA) * (1 - Math.exp(-dwell / p0.tauRunningS)), 1e-9);
    }
    expect(resting).toBeGreaterThan(0);
    expect(p0.iFinalRestingA).not.toBe(p0.iFinalRunningA);

    const probe = prep(sd, limitedNoBallast());
    const min = (probe.moduleSupplyRestingV! + probe.moduleSupplyRunningV!) / 2;
    const p = prep(sd, limitedNoBallast({ supplyMinV: min }));
    expect(p.moduleSupplyRestingV!).toBeLessThan(min);
    expect(p.moduleSupplyRunningV!).toBeGreaterThan(min);
    const ws = sweep(p, gd);
    for (let i = 0; i < gd.n; i++) {
      // no-spark.ts: below its minimum supply the module does not switch.
      const own = gd.cranking[i] === 1 ? p.moduleSupplyCrankingV! : gd.resting[i] === 1 ? p.moduleSupplyRestingV! : p.moduleSupplyRunningV!;
      expect(ws.noSpark[i], `point ${i}`).toBe(own < min ? 1 : 0);
    }
  });

  it('current-limited module heat: switch loss 0.5 V_sw i t_d / T plus (V - V_sw - I_lim R) I_lim t_hold / T while held', () => {
    for (const sat of [0, 1.5]) {
      const p = prep(s, limitedNoBallast({ switchSaturationV: sat }));
      expect(p.limitA).toBeLessThan(p.iFinalRunningA);
      const ws = sweep(p, g);
      let heldPts = 0;
      let shortPts = 0;
      for (let i = 0; i < g.n; i++) {
        const cr = g.cranking[i] === 1;
        const V = cr ? p.crankingSupplyV : p.runningSupplyV;
        const R = cr ? p.rCrankingOhm : p.rRunningOhm;
        const iF = cr ? p.iFinalCrankingA : p.iFinalRunningA;
        const tau = cr ? p.tauCrankingS : p.tauRunningS;
        if (!(p.limitA < iF)) continue;
        // Time to the limit: I_lim = I_f (1 - e^(-t/tau)).
        const tLim = -tau * Math.log(1 - p.limitA / iF);
        const T = g.periodS[i]!;
        const dwell = ws.dwellS[i]!;
        // Dwell law: time to limit plus the hold, capped at the maximum duty (dwell.ts).
        rel(dwell, Math.min(p.maxDuty * T, tLim + p.holdS), 1e-9);
        const held = dwell - tLim;
        let w = (p.switchDropV * 0.5 * ws.currentA[i]! * dwell) / T;
        if (held > 0) { heldPts++; w += (Math.max(0, V - p.switchDropV - p.limitA * R) * p.limitA * held) / T; } else shortPts++;
        rel(ws.moduleW[i]!, w, 1e-9);
        if (sat === 0 && held > 0) expect(ws.moduleW[i]).toBeGreaterThan(0);
      }
      expect(heldPts).toBeGreaterThan(0);
      if (sat > 0) expect(shortPts).toBeGreaterThan(0);
    }
  });

  it('fouled-plug peak: flux current of the shunt-loaded charge x peak per ampere, capped at the clamp (fouled.ts)', () => {
    let capped = 0;
    for (const setup of [pointsSetup(), limitedNoBallast(), limitedWithBallast(), fixedDuty(), limitedNoBallast({ name: 'Low clamp', primaryClampV: 25 })]) {
      const p = prep(s, setup);
      const ws = sweep(p, g);
      const rsh = reflectedShuntOhm(p.fouledShuntOhm, p.secondaryResistanceOhm, p.n);
      for (let i = 0; i < g.n; i++) {
        const cr = g.cranking[i] === 1;
        const perRpm = p.ironBallast !== null && !cr;
        const r = ws.resistanceOhm[i]!;
        const iF = perRpm ? (ws.supplyV[i]! - p.switchDropV) / r : cr ? p.iFinalCrankingA : p.iFinalRunningA;
        const tau = perRpm ? p.primaryInductanceH / r : cr ? p.tauCrankingS : p.tauRunningS;
        const tauF = fouledChargeTauS(tau, r, rsh);
        const flux = fouledFluxCurrentA(iF, tauF, ws.dwellS[i]!, p.limitA, fouledTimeToLimitS(iF, tauF, r, rsh, p.limitA), p.primaryInductanceH / rsh);
        const want = Math.min(flux * p.fouledVPerA, p.capV);
        if (flux * p.fouledVPerA > p.capV) capped++;
        rel(ws.fouledV[i]!, want, 1e-9);
        // Spark duration (Ls/Rs) ln(1 + Rs Is0 / V_arc), Is0 = eta i / n (secondary.ts).
        expect(ws.durationS[i]).toBe(inductiveSparkDurationS(p.secondaryInductanceH, p.secondaryResistanceOhm, (p.eta * ws.currentA[i]!) / p.n, p.arcV));
      }
    }
    expect(capped).toBeGreaterThan(0);
  });

  it('iron ballast settles at each running rpm: T = T_amb + theta <i^2> R(T) (steady-state energy balance, Incropera & DeWitt)', () => {
    const p = prep(s, limitedWithBallast());
    const b = p.ironBallast!;
    const ws = sweep(p, g);
    const temps = new Set<number>();
    for (let i = 0; i < g.n; i++) {
      if (g.cranking[i] === 1) { expect(ws.ballastK[i]).toBe(p.ballastColdK); continue; }
      const tK = ws.ballastK[i]!;
      temps.add(tK);
      const rb = ironBallastResistanceOhm(b.coldOhm, tK);
      rel(ws.resistanceOhm[i]!, b.restOhm + rb, 1e-12);
      const iF = (ws.supplyV[i]! - p.switchDropV) / ws.resistanceOhm[i]!;
      const tau = p.primaryInductanceH / ws.resistanceOhm[i]!;
      const ms = meanSquareCurrentA2(iF, tau, dwellTimeS(p, g.periodS[i]!, g.rpm[i]!, iF, tau), g.periodS[i]!, p.limitA);
      expect(Math.abs(b.ambientK + b.thetaKPerW * ms * rb - tK), `point ${i}`).toBeLessThan(1e-3);
    }
    expect(temps.size).toBeGreaterThan(3);
  });
});
