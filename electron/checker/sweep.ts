/**
 * The rpm sweep: for each point of a grid, dwell, current at break, energy, available and
 * required voltage, reserve, rise time, spark duration, fouled-plug peak, CD charge. Results go
 * into preallocated columns so that the parts-bin search can reuse one workspace for thousands
 * of combinations without allocating in the loop.
 */
import { cdChargeVoltageV } from './cd.js';
import { chargeCurrentA, timeToReachS } from './charge.js';
import { airBreakdownV, paschenBreakdownFromReducedV } from './breakdown.js';
import { cdFouledFraction } from './fouled.js';
import { magnetoBreakCurrentA } from './magneto.js';
import { inductiveSparkDurationS } from './secondary.js';
import type { RpmGrid } from './grid.js';
import type { PreparedSetup } from './prepare.js';
import { dwellTimeS, DwellMode } from './timing.js';

export interface Workspace {
  n: number;
  supplyV: Float64Array;
  resistanceOhm: Float64Array;
  dwellS: Float64Array;
  offS: Float64Array;
  currentA: Float64Array;
  energyJ: Float64Array;
  availableV: Float64Array;
  requiredV: Float64Array;
  reserveRatio: Float64Array;
  riseS: Float64Array;
  durationS: Float64Array;
  fouledV: Float64Array;
  cdChargeV: Float64Array;
  multiSpark: Uint8Array;
  moduleW: Float64Array;
}

export function createWorkspace(n: number): Workspace {
  const f = (): Float64Array => new Float64Array(n);
  return {
    n,
    supplyV: f(),
    resistanceOhm: f(),
    dwellS: f(),
    offS: f(),
    currentA: f(),
    energyJ: f(),
    availableV: f(),
    requiredV: f(),
    reserveRatio: f(),
    riseS: f(),
    durationS: f(),
    fouledV: f(),
    cdChargeV: f(),
    multiSpark: new Uint8Array(n),
    moduleW: f(),
  };
}

/** Required voltage at each grid point for a gap, into `out`. */
export function requiredInto(out: Float64Array, grid: RpmGrid, gapM: number, paschen: boolean, polarityFactor: number): void {
  const gapCm = gapM * 100;
  for (let i = 0; i < grid.n; i++) {
    const x = gapCm * grid.densityFactor[i]!;
    out[i] = (paschen ? paschenBreakdownFromReducedV(x) : airBreakdownV(x)) * polarityFactor;
  }
}

/**
 * Fill `ws` for every point of `grid`. `required` may carry the required voltage already computed
 * for this grid, gap, law and polarity (the search shares one array across thousands of setups).
 */
export function evaluateGrid(p: PreparedSetup, grid: RpmGrid, gapM: number, ws: Workspace, required?: Float64Array): void {
  if (required && required.length === grid.n) ws.requiredV.set(required);
  else requiredInto(ws.requiredV, grid, gapM, p.model === 'paschen', p.polarityFactor);
  const cd = p.cd;
  for (let i = 0; i < grid.n; i++) {
    const rpm = grid.rpm[i]!;
    const period = grid.periodS[i]!;
    const cranking = grid.cranking[i] === 1;
    const supply = cranking ? p.crankingSupplyV : p.runningSupplyV;
    const r = cranking ? p.rCrankingOhm : p.rRunningOhm;
    const iFinal = cranking ? p.iFinalCrankingA : p.iFinalRunningA;
    const tau = cranking ? p.tauCrankingS : p.tauRunningS;
    ws.supplyV[i] = supply;
    ws.resistanceOhm[i] = r;
    let available: number;
    if (p.mode === DwellMode.Cd) {
      let v = 0;
      let multi = 0;
      let moduleW = 0;
      if (cd) {
        const modSupply = (cranking ? p.moduleSupplyCrankingV : p.moduleSupplyRunningV) ?? supply;
        v = cdChargeVoltageV(cd.nominalV, cd.capacitorF, cd.chargerPowerW, period, modSupply, cd.supplyMinV, cd.cutOutV);
        multi = cd.multiSparkBelowRpm !== null && rpm < cd.multiSparkBelowRpm ? 1 : 0;
        // Converter loss, taking a 70 % efficient charger (from memory).
        moduleW = ((0.5 * cd.capacitorF * v * v) / period) * (0.3 / 0.7);
      }
      const energy = cd ? 0.5 * cd.capacitorF * v * v : 0;
      const peak = cd ? Math.min(cd.peakPerChargeV * v, p.capV) : 0;
      const rise = cd && peak > 0 ? peak / cd.riseRateVPerS : 0;
      available = peak;
      ws.dwellS[i] = 0;
      ws.offS[i] = period;
      ws.currentA[i] = 0;
      ws.energyJ[i] = energy;
      ws.riseS[i] = rise;
      ws.durationS[i] = peak > 0 && cd ? cd.sparkDurationS : 0;
      ws.fouledV[i] = peak * cdFouledFraction(rise, p.fouledShuntOhm, p.secondaryCapacitanceF);
      ws.cdChargeV[i] = v;
      ws.multiSpark[i] = multi;
      ws.moduleW[i] = moduleW;
    } else {
      let dwell: number;
      let current: number;
      let moduleW = 0;
      if (p.mode === DwellMode.Magneto) {
        dwell = dwellTimeS(p, period, rpm, 0, tau);
        current = magnetoBreakCurrentA(rpm, p.magnetoRatedA, p.magnetoFullRpm);
      } else {
        dwell = dwellTimeS(p, period, rpm, iFinal, tau);
        current = chargeCurrentA(iFinal, tau, dwell);
        if (current > p.limitA) current = p.limitA;
        if (p.switchDropV > 0 || p.limitA < Infinity) {
          // Switch loss while charging (about half the break current on average), plus the linear
          // loss while the module holds the limit: (V - I_lim R) I_lim for the held part of the dwell.
          moduleW = (p.switchDropV * 0.5 * current * dwell) / period;
          if (p.limitA < iFinal) {
            const held = dwell - timeToReachS(iFinal, tau, p.limitA);
            if (held > 0) moduleW += (Math.max(0, supply - p.switchDropV - p.limitA * r) * p.limitA * held) / period;
          }
        }
      }
      const energy = 0.5 * p.primaryInductanceH * current * current;
      available = current * p.voltsPerAmp * p.eta;
      if (available > p.capV) available = p.capV;
      let fouled = current * p.fouledVPerA;
      if (fouled > p.capV) fouled = p.capV;
      ws.dwellS[i] = dwell;
      ws.offS[i] = period - dwell;
      ws.currentA[i] = current;
      ws.energyJ[i] = energy;
      ws.riseS[i] = p.riseS;
      ws.durationS[i] = inductiveSparkDurationS(p.secondaryInductanceH, p.secondaryResistanceOhm, (p.eta * current) / p.n, p.arcV);
      ws.fouledV[i] = fouled;
      ws.cdChargeV[i] = 0;
      ws.multiSpark[i] = 0;
      ws.moduleW[i] = moduleW;
    }
    ws.availableV[i] = available;
    const req = ws.requiredV[i]!;
    ws.reserveRatio[i] = req > 0 ? available / req : available > 0 ? 1e6 : 0;
  }
}
