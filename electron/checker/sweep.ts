/**
 * The rpm sweep: for each point of a grid, dwell, current at break, energy, available and
 * required voltage, reserve, rise time, spark duration, fouled-plug peak, CD charge. Results go
 * into preallocated columns so that the parts-bin search can reuse one workspace for thousands
 * of combinations without allocating in the loop.
 */
import { moduleCutOut, noSparkPoint } from './no-spark.js';
import { capacitorEnergyJ, cdChargeVoltageV } from './cd.js';
import { chargeCurrentA, inductorEnergyJ, timeToReachS } from './charge.js';
import { airBreakdownV, paschenBreakdownFromReducedV } from './breakdown.js';
import { cdFouledFraction, fouledChargeTauS, fouledFluxCurrentA, fouledTimeToLimitS, reflectedShuntOhm } from './fouled.js';
import { magnetoBreakCurrentA } from './magneto.js';
import { finalCurrentA } from './primary.js';
import { availableSecondaryV, inductiveSparkDurationS } from './secondary.js';
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
  /** 1 where the module's own supply is below what it needs to switch (its cut-out): no spark at all. */
  noSpark: Uint8Array;
  moduleW: Float64Array;
  /** Available voltage before the coil's secondary ceiling (after the clamp, which is the circuit's own limit). */
  uncappedV: Float64Array;
  /** Ballast temperature at each point (the surroundings without a ballast). */
  ballastK: Float64Array;
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
    noSpark: new Uint8Array(n),
    moduleW: f(),
    uncappedV: f(),
    ballastK: f(),
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
  /**
   * With `verdictOnly`: the off-time fail ratio (off time / spark duration below it fails). A
   * point whose off time is at least this ratio times the longest the spark could last there
   * (Ls Is0 / V_arc, the duration without series resistance, since ln(1 + x) <= x) cannot fail on
   * it, so its spark duration is left NaN instead of worked out (no rule but the off time reads
   * the column, and a NaN duration never counts as the worst ratio).
   */
  offTimeFailRatio?: number;
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
  const offRatio = !fouledToo && scope?.offTimeFailRatio !== undefined ? scope.offTimeFailRatio : 0;
  if (p.mode === DwellMode.Cd) cdPoints(p, grid, ws, crankingOnly, fouledToo);
  else inductivePoints(p, grid, ws, crankingOnly, fouledToo, offRatio);
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
  // Columns, grid and circuit constants as locals: the loop then reads no object field per point.
  const availableVCol = ws.availableV;
  const ballastKCol = ws.ballastK;
  const cdChargeVCol = ws.cdChargeV;
  const currentACol = ws.currentA;
  const durationSCol = ws.durationS;
  const dwellSCol = ws.dwellS;
  const energyJCol = ws.energyJ;
  const fouledVCol = ws.fouledV;
  const moduleWCol = ws.moduleW;
  const multiSparkCol = ws.multiSpark;
  const noSparkCol = ws.noSpark;
  const offSCol = ws.offS;
  const requiredVCol = ws.requiredV;
  const reserveRatioCol = ws.reserveRatio;
  const resistanceOhmCol = ws.resistanceOhm;
  const riseSCol = ws.riseS;
  const supplyVCol = ws.supplyV;
  const uncappedVCol = ws.uncappedV;
  const crankingGrid = grid.cranking;
  const periodSGrid = grid.periodS;
  const restingGrid = grid.resting;
  const rpmGrid = grid.rpm;
  const clampCapVP = p.clampCapV;
  const ceilingVP = p.ceilingV;
  const fouledShuntOhmP = p.fouledShuntOhm;
  const secondaryCapacitanceFP = p.secondaryCapacitanceF;
  const ballastHotKP = p.ballastHotK;
  for (let i = 0; i < grid.n; i++) {
    const cranking = crankingGrid[i] === 1;
    if (crankingOnly && !cranking) continue;
    const resting = restingGrid[i] === 1;
    const rpm = rpmGrid[i]!;
    const period = periodSGrid[i]!;
    const supply = cranking ? p.crankingSupplyV : resting ? p.restingSupplyV : p.runningSupplyV;
    supplyVCol[i] = supply;
    resistanceOhmCol[i] = cranking ? p.rCrankingOhm : p.rRunningOhm;
    let v = 0;
    let multi = 0;
    let moduleW = 0;
    let dead = 0;
    let energy = 0;
    if (cd) {
      const modSupply = (cranking ? p.moduleSupplyCrankingV : resting ? p.moduleSupplyRestingV : p.moduleSupplyRunningV) ?? supply;
      dead = modSupply > cd.cutOutV ? 0 : 1; // the charger stops at its cut-out: no spark (no-spark.ts)
      v = cdChargeVoltageV(cd.nominalV, cd.capacitorF, cd.chargerPowerW, period, modSupply, cd.supplyMinV, cd.cutOutV);
      multi = cd.multiSparkBelowRpm !== null && rpm < cd.multiSparkBelowRpm ? 1 : 0;
      // 0.5 C V^2, the one capacitor-energy law (cd.ts).
      energy = capacitorEnergyJ(cd.capacitorF, v);
      // Converter loss, taking a 70 % efficient charger (from memory).
      moduleW = (energy / period) * (0.3 / 0.7);
    }
    let uncapped = cd ? (cranking ? cd.peakPerChargeCrankingV : cd.peakPerChargeV) * v : 0;
    if (uncapped > clampCapVP) uncapped = clampCapVP;
    const peak = uncapped > ceilingVP ? ceilingVP : uncapped;
    // The loop's peak time (cd.ts): the same at every point of a supply case while there is a spark.
    const rise = cd && peak > 0 ? (cranking ? cd.riseCrankingS : cd.riseS) : 0;
    if (fouledToo && rise !== lastRise) {
      lastRise = rise;
      lastFouledFraction = cdFouledFraction(rise, fouledShuntOhmP, secondaryCapacitanceFP);
    }
    dwellSCol[i] = 0;
    offSCol[i] = period;
    currentACol[i] = 0;
    energyJCol[i] = energy;
    riseSCol[i] = rise;
    durationSCol[i] = peak > 0 && cd ? cd.sparkDurationS : 0;
    fouledVCol[i] = fouledToo ? peak * lastFouledFraction : NaN;
    cdChargeVCol[i] = v;
    multiSparkCol[i] = multi;
    noSparkCol[i] = dead;
    moduleWCol[i] = moduleW;
    availableVCol[i] = peak;
    uncappedVCol[i] = uncapped;
    ballastKCol[i] = ballastHotKP;
    reserveRatioCol[i] = reserveRatio(peak, requiredVCol[i]!);
  }
}

/**
 * Weights carrying a value on from the three grid points before each point (the parabola through
 * them, Lagrange form): 3 per point, 0 for the first three. A grid's rpm never change, so they are
 * worked out once per grid and the sweep's ballast start costs three products a point.
 */
const carryWeights = new WeakMap<RpmGrid, Float64Array>();
export function carryWeightsOf(grid: RpmGrid): Float64Array {
  let w = carryWeights.get(grid);
  if (!w) {
    w = new Float64Array(3 * grid.n);
    const x = grid.rpm;
    for (let i = 3; i < grid.n; i++) {
      const x0 = x[i]!;
      const x1 = x[i - 1]!;
      const x2 = x[i - 2]!;
      const x3 = x[i - 3]!;
      w[3 * i] = ((x0 - x2) * (x0 - x3)) / ((x1 - x2) * (x1 - x3));
      w[3 * i + 1] = ((x0 - x1) * (x0 - x3)) / ((x2 - x1) * (x2 - x3));
      w[3 * i + 2] = ((x0 - x1) * (x0 - x2)) / ((x3 - x1) * (x3 - x2));
    }
    carryWeights.set(grid, w);
  }
  return w;
}

/**
 * Where the ballast solution at grid point `i` (rpm `x0`) starts: the answers `k1`, `k2`, `k3` at
 * the last three points solved (rpm `x1`, `x2` for the first two; NaN where there is none yet)
 * carried on to this rpm. The parabola through three (the grid's `weights`, carryWeightsOf) when
 * they are the three points just before this one (`consecutive`), else the line through the last
 * two, the last answer alone, or `startK` before any.
 */
export function carriedStartK(weights: Float64Array, i: number, k1: number, k2: number, k3: number, consecutive: boolean, x0: number, x1: number, x2: number, startK: number): number {
  if (k1 !== k1) return startK;
  if (k2 !== k2) return k1;
  if (k3 !== k3 || !consecutive) return k1 + ((k1 - k2) * (x0 - x1)) / (x1 - x2);
  return weights[3 * i]! * k1 + weights[3 * i + 1]! * k2 + weights[3 * i + 2]! * k3;
}

/** Supply cases of the inductive loop: values that hold for every point of one case are worked out once. */
const CRANKING = 0;
const RUNNING = 1;
const RESTING = 2;

/** Inductive: the coil charges for the dwell and hands 0.5 L i^2 to the secondary at break. */
function inductivePoints(p: PreparedSetup, grid: RpmGrid, ws: Workspace, crankingOnly: boolean, fouledToo: boolean, offRatio: number): void {
  const magneto = p.mode === DwellMode.Magneto;
  const ballast = p.ironBallast;
  // On a fouled plug the shunt loads the dwell too (fouled.ts): the flux charges with a longer
  // time constant, and a limiter, which holds the total primary current, takes over at another time.
  const shuntOhm = reflectedShuntOhm(p.fouledShuntOhm, p.secondaryResistanceOhm, p.n);
  const holdTauS = p.primaryInductanceH / shuntOhm;
  let lastCase = -1;
  let supply = 0;
  let r = 0;
  let iFinal = 0;
  let tau = 0;
  let toLimitS = Infinity;
  let tauFouledS = 0;
  let fouledLimitS = Infinity;
  let lastDwell = NaN;
  let lastCharged = 0;
  let lastFluxA = 0;
  let lastCurrent = NaN;
  let lastDuration = 0;
  // The iron ballast's last two running temperatures and the slope there, to start the next solution.
  let prevK = NaN;
  let prevPrevK = NaN;
  let prev3K = NaN;
  let rpm1 = 0;
  let rpm2 = 0;
  let prevSlope = -1;
  // Carrying on through the last three points needs them to be this point's three grid neighbours.
  let lastSolved = -2;
  const weights = ballast !== null ? carryWeightsOf(grid) : null;
  let ballastK = p.ballastHotK;
  let dead = false; // the module below its minimum supply for this case does not switch (no-spark.ts)
  // Columns, grid and circuit constants as locals: the loop then reads no object field per point.
  const availableVCol = ws.availableV;
  const ballastKCol = ws.ballastK;
  const cdChargeVCol = ws.cdChargeV;
  const currentACol = ws.currentA;
  const durationSCol = ws.durationS;
  const dwellSCol = ws.dwellS;
  const energyJCol = ws.energyJ;
  const fouledVCol = ws.fouledV;
  const moduleWCol = ws.moduleW;
  const multiSparkCol = ws.multiSpark;
  const noSparkCol = ws.noSpark;
  const offSCol = ws.offS;
  const requiredVCol = ws.requiredV;
  const reserveRatioCol = ws.reserveRatio;
  const resistanceOhmCol = ws.resistanceOhm;
  const riseSCol = ws.riseS;
  const supplyVCol = ws.supplyV;
  const uncappedVCol = ws.uncappedV;
  const crankingGrid = grid.cranking;
  const periodSGrid = grid.periodS;
  const restingGrid = grid.resting;
  const rpmGrid = grid.rpm;
  const limitAP = p.limitA;
  const switchDropVP = p.switchDropV;
  const primaryInductanceHP = p.primaryInductanceH;
  const peakVPerAP = p.peakVPerA;
  const clampCapVP = p.clampCapV;
  const ceilingVP = p.ceilingV;
  const fouledVPerAP = p.fouledVPerA;
  const capVP = p.capV;
  const secondaryInductanceHP = p.secondaryInductanceH;
  const secondaryResistanceOhmP = p.secondaryResistanceOhm;
  const etaP = p.eta;
  const nP = p.n;
  const arcVP = p.arcV;
  const riseSP = p.riseS;
  // The fail ratio times the longest spark per primary ampere at break, Ls (eta / n) / V_arc, with
  // a part in 10^8 to spare for rounding (SweepScope.offTimeFailRatio).
  const longestSparkPerA = offRatio > 0 ? offRatio * ((secondaryInductanceHP * (etaP / nP)) / arcVP) * (1 + 1e-8) : 0;
  for (let i = 0; i < grid.n; i++) {
    const cranking = crankingGrid[i] === 1;
    if (crankingOnly && !cranking) continue;
    const rpm = rpmGrid[i]!;
    const period = periodSGrid[i]!;
    const sc = cranking ? CRANKING : restingGrid[i] === 1 ? RESTING : RUNNING;
    if (sc !== lastCase) {
      // Everything that holds for a whole supply case (without an iron ballast, that is every
      // running point): supply, resistance, final current, time constant, time to the limit.
      lastCase = sc;
      lastDwell = NaN;
      lastCurrent = NaN;
      supply = sc === CRANKING ? p.crankingSupplyV : sc === RESTING ? p.restingSupplyV : p.runningSupplyV;
      r = sc === CRANKING ? p.rCrankingOhm : p.rRunningOhm;
      iFinal = sc === CRANKING ? p.iFinalCrankingA : sc === RESTING ? p.iFinalRestingA : p.iFinalRunningA;
      tau = sc === CRANKING ? p.tauCrankingS : p.tauRunningS;
      toLimitS = timeToReachS(iFinal, tau, limitAP);
      tauFouledS = fouledChargeTauS(tau, r, shuntOhm);
      fouledLimitS = fouledTimeToLimitS(iFinal, tauFouledS, r, shuntOhm, limitAP);
      ballastK = cranking ? p.ballastColdK : p.ballastHotK;
      dead = moduleCutOut(p, sc === CRANKING ? p.moduleSupplyCrankingV : sc === RESTING ? p.moduleSupplyRestingV : p.moduleSupplyRunningV);
    }
    if (ballast !== null && !cranking) {
      // The iron ballast at this rpm's own equilibrium, from the neighbouring rpm's (ballast.ts).
      ballast.supplyV = supply;
      ballast.periodS = period;
      ballast.rpm = rpm;
      // Start from the neighbours' answers carried on to this rpm (through the last three, the
      // last two, or the last one alone), so the solution usually settles at its first step.
      const guess = carriedStartK(weights!, i, prevK, prevPrevK, prev3K, lastSolved === i - 1, rpm, rpm1, rpm2, p.ballastHotK);
      ballastK = ballast.settle(guess, prevSlope);
      prev3K = prevPrevK;
      prevPrevK = prevK;
      prevK = ballast.refinedK;
      rpm2 = rpm1;
      rpm1 = rpm;
      lastSolved = i;
      prevSlope = ballast.slope;
      // The circuit at the answer, as the solution's last evaluation left it (ballast.ts).
      r = ballast.rOhm;
      iFinal = ballast.finalA;
      tau = ballast.tauS;
      toLimitS = ballast.toLimitS;
      if (fouledToo) {
        tauFouledS = fouledChargeTauS(tau, r, shuntOhm);
        fouledLimitS = fouledTimeToLimitS(iFinal, tauFouledS, r, shuntOhm, limitAP);
      }
      // The dwell and the break current too: the same laws on the same inputs (dwell law, RL charge capped at the limit).
      lastDwell = ballast.dwellS;
      lastCharged = ballast.breakA;
      if (fouledToo) lastFluxA = fouledFluxCurrentA(iFinal, tauFouledS, lastDwell, limitAP, fouledLimitS, holdTauS);
    }
    supplyVCol[i] = supply;
    resistanceOhmCol[i] = r;
    if (dead) {
      noSparkPoint(ws, i, period, fouledToo);
      ballastKCol[i] = ballastK;
      continue;
    }
    const dwell = dwellGivenLimitTimeS(p, period, rpm, toLimitS);
    let current: number;
    let moduleW = 0;
    if (magneto) {
      current = magnetoBreakCurrentA(rpm, p.magnetoRatedA, p.magnetoFullRpm);
    } else {
      if (dwell !== lastDwell) {
        lastDwell = dwell;
        lastCharged = chargeCurrentA(iFinal, tau, dwell);
        if (lastCharged > limitAP) lastCharged = limitAP;
        if (fouledToo) lastFluxA = fouledFluxCurrentA(iFinal, tauFouledS, dwell, limitAP, fouledLimitS, holdTauS);
      }
      current = lastCharged;
      if (switchDropVP > 0 || limitAP < Infinity) {
        // Switch loss while charging (about half the break current on average), plus the linear
        // loss while the module holds the limit: (V - I_lim R) I_lim for the held part of the dwell.
        moduleW = (switchDropVP * 0.5 * current * dwell) / period;
        if (limitAP < iFinal) {
          const held = dwell - toLimitS;
          if (held > 0) moduleW += (Math.max(0, supply - switchDropVP - limitAP * r) * limitAP * held) / period;
        }
      }
    }
    // 0.5 L i^2, the one inductor-energy law (charge.ts).
    const energy = inductorEnergyJ(primaryInductanceHP, current);
    // i sqrt(Lp / C_eff) eta (damping folded into peakVPerA), capped at the clamp n V_clamp (secondary.ts).
    const uncapped = availableSecondaryV(current, peakVPerAP, 1, clampCapVP);
    const available = uncapped > ceilingVP ? ceilingVP : uncapped;
    // A magneto's fouled peak keeps its clean break current (its armature is not a battery RL charge).
    let fouled = (magneto ? current : lastFluxA) * fouledVPerAP;
    if (fouled > capVP) fouled = capVP;
    const offS = period - dwell;
    // (Verdict only) a point whose off time outlasts the longest spark it could have by the fail
    // ratio cannot fail the off-time test: its duration is not needed (SweepScope.offTimeFailRatio).
    const skipDuration = offRatio > 0 && longestSparkPerA * current <= offS;
    if (!skipDuration && current !== lastCurrent) {
      lastCurrent = current;
      lastDuration = inductiveSparkDurationS(secondaryInductanceHP, secondaryResistanceOhmP, (etaP * current) / nP, arcVP);
    }
    dwellSCol[i] = dwell;
    offSCol[i] = offS;
    currentACol[i] = current;
    energyJCol[i] = energy;
    riseSCol[i] = riseSP;
    durationSCol[i] = skipDuration ? NaN : lastDuration;
    fouledVCol[i] = fouledToo ? fouled : NaN;
    cdChargeVCol[i] = 0;
    multiSparkCol[i] = 0;
    noSparkCol[i] = 0;
    moduleWCol[i] = moduleW;
    availableVCol[i] = available;
    uncappedVCol[i] = uncapped;
    ballastKCol[i] = ballastK;
    reserveRatioCol[i] = reserveRatio(available, requiredVCol[i]!);
  }
}
