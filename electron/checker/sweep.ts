/**
 * The rpm sweep: for each point of a grid, dwell, current at break, energy, available and
 * required voltage, reserve, rise time, spark duration, fouled-plug peak, CD charge. Results go
 * into preallocated columns so that the parts-bin search can reuse one workspace for thousands
 * of combinations without allocating in the loop.
 */
import { cdChargeVoltageV } from './cd.js';
import { chargeCurrentA, timeToReachS } from './charge.js';
import { airBreakdownV, paschenBreakdownFromReducedV } from './breakdown.js';
import { cdFouledFraction, fouledChargeTauS, fouledFluxCurrentA, fouledTimeToLimitS, reflectedShuntOhm } from './fouled.js';
import { magnetoBreakCurrentA } from './magneto.js';
import { inductiveSparkDurationS } from './secondary.js';
import type { RpmGrid } from './grid.js';
import type { PreparedSetup } from './prepare.js';
import { dwellGivenLimitTimeS, DwellMode } from './timing.js';

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
  /** The shared array `requiredV` was last copied from (the search sweeps thousands of setups at one gap). */
  requiredFrom: Float64Array | null;
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
    requiredFrom: null,
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

/** What `evaluateGrid` may leave out. */
export interface SweepScope {
  /**
   * Recompute only the points on the cranking supply and keep the rest of `ws` as it is. The
   * search uses it for the cranking-bypass twin of a ballast combination, whose running points are
   * those of the combination just swept (the bypass only changes the cranking path).
   */
  crankingOnly?: boolean;
  /**
   * Leave out the fouled-plug column, which only the report reads (no rule and no fail test looks
   * at it); it is filled with NaN, so anything that did read it would disagree with the full
   * sweep. The search's verdict-only pass (judge.ts) uses it: on points and fixed-duty modules the
   * fouled charge is one more exponential at every point.
   */
  verdictOnly?: boolean;
}

/**
 * Fill `ws` for every point of `grid`. `required` may carry the required voltage already computed
 * for this grid, gap, law and polarity (the search shares one array across thousands of setups).
 *
 * Everything that does not change with rpm for one supply case (final current, time constant, the
 * time to reach the current limit) is worked out once per case, and a value is only recomputed
 * when its inputs change from the point before (a current-limited module usually holds the same
 * dwell and break current across the whole sweep): the same functions on the same inputs, so the
 * columns are exactly what a point-by-point evaluation gives.
 */
export function evaluateGrid(p: PreparedSetup, grid: RpmGrid, gapM: number, ws: Workspace, required?: Float64Array, scope?: SweepScope): void {
  if (required && required.length === grid.n) {
    if (ws.requiredFrom !== required) ws.requiredV.set(required);
    ws.requiredFrom = required;
  } else {
    requiredInto(ws.requiredV, grid, gapM, p.model === 'paschen', p.polarityFactor);
    ws.requiredFrom = null;
  }
  const crankingOnly = scope?.crankingOnly === true;
  const fouledToo = scope?.verdictOnly !== true;
  if (p.mode === DwellMode.Cd) cdPoints(p, grid, ws, crankingOnly, fouledToo);
  else inductivePoints(p, grid, ws, crankingOnly, fouledToo);
}

/** Available / required, with a gap that needs nothing counted as a huge reserve. */
function reserveRatio(available: number, required: number): number {
  return required > 0 ? available / required : available > 0 ? 1e6 : 0;
}

/** Capacitive discharge: the charge voltage the charger reaches each period sets everything. */
function cdPoints(p: PreparedSetup, grid: RpmGrid, ws: Workspace, crankingOnly: boolean, fouledToo: boolean): void {
  const cd = p.cd;
  let lastRise = NaN;
  let lastFouledFraction = 0;
  for (let i = 0; i < grid.n; i++) {
    const cranking = grid.cranking[i] === 1;
    if (crankingOnly && !cranking) continue;
    const rpm = grid.rpm[i]!;
    const period = grid.periodS[i]!;
    const supply = cranking ? p.crankingSupplyV : p.runningSupplyV;
    ws.supplyV[i] = supply;
    ws.resistanceOhm[i] = cranking ? p.rCrankingOhm : p.rRunningOhm;
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
    const peak = cd ? Math.min((cranking ? cd.peakPerChargeCrankingV : cd.peakPerChargeV) * v, p.capV) : 0;
    const rise = cd && peak > 0 ? peak / cd.riseRateVPerS : 0;
    if (fouledToo && rise !== lastRise) {
      lastRise = rise;
      lastFouledFraction = cdFouledFraction(rise, p.fouledShuntOhm, p.secondaryCapacitanceF);
    }
    ws.dwellS[i] = 0;
    ws.offS[i] = period;
    ws.currentA[i] = 0;
    ws.energyJ[i] = energy;
    ws.riseS[i] = rise;
    ws.durationS[i] = peak > 0 && cd ? cd.sparkDurationS : 0;
    ws.fouledV[i] = fouledToo ? peak * lastFouledFraction : NaN;
    ws.cdChargeV[i] = v;
    ws.multiSpark[i] = multi;
    ws.moduleW[i] = moduleW;
    ws.availableV[i] = peak;
    ws.reserveRatio[i] = reserveRatio(peak, ws.requiredV[i]!);
  }
}

/** Inductive: the coil charges for the dwell and hands 0.5 L i^2 to the secondary at break. */
function inductivePoints(p: PreparedSetup, grid: RpmGrid, ws: Workspace, crankingOnly: boolean, fouledToo: boolean): void {
  const magneto = p.mode === DwellMode.Magneto;
  // Time for the RL rise to reach the module's current limit, per supply case (Infinity if never).
  const limitRunS = timeToReachS(p.iFinalRunningA, p.tauRunningS, p.limitA);
  const limitCrankS = timeToReachS(p.iFinalCrankingA, p.tauCrankingS, p.limitA);
  // On a fouled plug the shunt loads the dwell too (fouled.ts): the flux charges with a longer
  // time constant, and a limiter, which holds the total primary current, takes over at another time.
  const shuntOhm = reflectedShuntOhm(p.fouledShuntOhm, p.secondaryResistanceOhm, p.n);
  const holdTauS = p.primaryInductanceH / shuntOhm;
  const tauFouledRunS = fouledChargeTauS(p.tauRunningS, p.rRunningOhm, shuntOhm);
  const tauFouledCrankS = fouledChargeTauS(p.tauCrankingS, p.rCrankingOhm, shuntOhm);
  const fouledLimitRunS = fouledTimeToLimitS(p.iFinalRunningA, tauFouledRunS, p.rRunningOhm, shuntOhm, p.limitA);
  const fouledLimitCrankS = fouledTimeToLimitS(p.iFinalCrankingA, tauFouledCrankS, p.rCrankingOhm, shuntOhm, p.limitA);
  let lastCase = -1;
  let lastDwell = NaN;
  let lastCharged = 0;
  let lastFluxA = 0;
  let lastCurrent = NaN;
  let lastDuration = 0;
  for (let i = 0; i < grid.n; i++) {
    const cranking = grid.cranking[i] === 1;
    if (crankingOnly && !cranking) continue;
    const rpm = grid.rpm[i]!;
    const period = grid.periodS[i]!;
    const supply = cranking ? p.crankingSupplyV : p.runningSupplyV;
    const r = cranking ? p.rCrankingOhm : p.rRunningOhm;
    const iFinal = cranking ? p.iFinalCrankingA : p.iFinalRunningA;
    const tau = cranking ? p.tauCrankingS : p.tauRunningS;
    const toLimitS = cranking ? limitCrankS : limitRunS;
    if ((cranking ? 1 : 0) !== lastCase) {
      lastCase = cranking ? 1 : 0;
      lastDwell = NaN;
      lastCurrent = NaN;
    }
    ws.supplyV[i] = supply;
    ws.resistanceOhm[i] = r;
    const dwell = dwellGivenLimitTimeS(p, period, rpm, toLimitS);
    let current: number;
    let moduleW = 0;
    if (magneto) {
      current = magnetoBreakCurrentA(rpm, p.magnetoRatedA, p.magnetoFullRpm);
    } else {
      if (dwell !== lastDwell) {
        lastDwell = dwell;
        lastCharged = chargeCurrentA(iFinal, tau, dwell);
        if (lastCharged > p.limitA) lastCharged = p.limitA;
        if (fouledToo) {
          lastFluxA = cranking
            ? fouledFluxCurrentA(iFinal, tauFouledCrankS, dwell, p.limitA, fouledLimitCrankS, holdTauS)
            : fouledFluxCurrentA(iFinal, tauFouledRunS, dwell, p.limitA, fouledLimitRunS, holdTauS);
        }
      }
      current = lastCharged;
      if (p.switchDropV > 0 || p.limitA < Infinity) {
        // Switch loss while charging (about half the break current on average), plus the linear
        // loss while the module holds the limit: (V - I_lim R) I_lim for the held part of the dwell.
        moduleW = (p.switchDropV * 0.5 * current * dwell) / period;
        if (p.limitA < iFinal) {
          const held = dwell - toLimitS;
          if (held > 0) moduleW += (Math.max(0, supply - p.switchDropV - p.limitA * r) * p.limitA * held) / period;
        }
      }
    }
    const energy = 0.5 * p.primaryInductanceH * current * current;
    let available = current * p.voltsPerAmp * p.eta;
    if (available > p.capV) available = p.capV;
    // A magneto's fouled peak keeps its clean break current (its armature is not a battery RL charge).
    let fouled = (magneto ? current : lastFluxA) * p.fouledVPerA;
    if (fouled > p.capV) fouled = p.capV;
    if (current !== lastCurrent) {
      lastCurrent = current;
      lastDuration = inductiveSparkDurationS(p.secondaryInductanceH, p.secondaryResistanceOhm, (p.eta * current) / p.n, p.arcV);
    }
    ws.dwellS[i] = dwell;
    ws.offS[i] = period - dwell;
    ws.currentA[i] = current;
    ws.energyJ[i] = energy;
    ws.riseS[i] = p.riseS;
    ws.durationS[i] = lastDuration;
    ws.fouledV[i] = fouledToo ? fouled : NaN;
    ws.cdChargeV[i] = 0;
    ws.multiSpark[i] = 0;
    ws.moduleW[i] = moduleW;
    ws.availableV[i] = available;
    ws.reserveRatio[i] = reserveRatio(available, ws.requiredV[i]!);
  }
}
