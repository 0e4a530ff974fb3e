/**
 * An iron-wire ballast while the engine runs: at each rpm it settles where the heat it sheds
 * balances the heat the coil current puts in, T = T_amb + theta <i^2> R(T) (steady-state energy
 * balance of a resistor with a thermal resistance to its surroundings, Incropera & DeWitt,
 * Fundamentals of Heat and Mass Transfer, ch. 1 and 3). The mean square <i^2> is that of the actual
 * charging waveform at that rpm, so the ballast runs cooler (and passes more current) where the
 * dwell is a smaller part of a longer time constant, at high rpm.
 *
 * Its thermal time constant is seconds, far longer than a firing period, so the steady state at
 * each rpm is what the engine held at that speed sees. The temperature at idle (solved once, in
 * prepare.ts) is also what the ballast holds just after a long idle.
 *
 * The sweep solves every running point from its neighbour's answer (secant steps from the
 * neighbour's temperature and slope) rather than bisecting afresh; where that does not settle on
 * a stable equilibrium it falls back to bisection, which always does (see `settle`).
 */
import { meanSquareWithChargeA2, timeToReachS } from './charge.js';
import { finalCurrentA } from './primary.js';
import { ironBallastResistanceOhm, selfHeatedTemperatureK } from './thermal.js';
import { dwellGivenLimitTimeS, DwellMode, type DwellParams } from './timing.js';

/**
 * A secant step smaller than this (kelvin) ends the solution: the resistance is then known to
 * better than a part in 10^6, far finer than any catalogue value.
 */
export const BALLAST_TOLERANCE_K = 1e-4;
/** Search range above the surroundings, as for the bisection (thermal.ts). */
const SPAN_K = 1500;
const MAX_STEPS = 12;

/**
 * The coil circuit that heats the ballast, fixed for one setup, with the operating point (`supplyV`,
 * `periodS`, `rpm`) set before each solution. One object per prepared setup, reused point after
 * point, so the sweep allocates nothing.
 */
export class RunningBallast {
  supplyV = 0;
  periodS = 1;
  rpm = 0;
  /** Slope dg/dT of the last solution (negative at a stable equilibrium), for the next point's first step. */
  slope = -1;
  /** The last answer with its final (untaken) secant step added: the better start for a neighbour. */
  refinedK = NaN;
  /**
   * The circuit at the answer, as its last evaluation left it (the answer is always the point
   * evaluated last): total resistance, final current, time constant, time to the limit, dwell and
   * current at break (min(I_final (1 - e^(-t_d/tau)), I_lim), the charge law of charge.ts).
   */
  rOhm = 0;
  finalA = 0;
  tauS = 0;
  toLimitS = Infinity;
  dwellS = 0;
  breakA = 0;

  constructor(
    readonly coldOhm: number,
    readonly thetaKPerW: number,
    readonly ambientK: number,
    /** Everything else in the coil circuit, hot: coil winding, harness, contact. */
    readonly restOhm: number,
    readonly switchDropV: number,
    readonly inductanceH: number,
    readonly dwell: DwellParams,
  ) {}

  /** Ballast resistance at a temperature. */
  resistanceOhm(tK: number): number {
    return ironBallastResistanceOhm(this.coldOhm, tK);
  }

  /** Heat put in at temperature T, watts: <i^2> R(T) over the charging waveform at this point. */
  powerW(tK: number): number {
    const rb = ironBallastResistanceOhm(this.coldOhm, tK);
    const r = this.restOhm + rb;
    const iF = finalCurrentA(this.supplyV, this.switchDropV, r);
    const tau = this.inductanceH / r;
    const limitA = this.dwell.limitA;
    // The time to the limit once (the dwell law and the mean square both need it).
    const tl = limitA < iF && tau > 0 ? timeToReachS(iF, tau, limitA) : Infinity;
    const td = dwellGivenLimitTimeS(this.dwell, this.periodS, this.rpm, this.dwell.mode === DwellMode.CurrentLimited ? tl : Infinity);
    this.rOhm = r;
    this.finalA = iF;
    this.tauS = tau;
    this.toLimitS = tl;
    this.dwellS = td;
    // 1 - e^(-t_d/tau) once, for the break current (the product chargeCurrentA forms, so it is bit
    // for bit the charge law's) and for the mean square; past the limit the current is the limit.
    const fraction = tau > 0 && td > 0 && !(tl < td) ? -Math.expm1(-td / tau) : NaN;
    const charged = !(iF > 0) || !(td > 0) ? 0 : tl < td ? Infinity : tau > 0 ? iF * fraction : iF;
    this.breakA = charged > limitA ? limitA : charged;
    return meanSquareWithChargeA2(iF, tau, td, this.periodS, limitA, tl, fraction) * rb;
  }

  /** g(T) = T_amb + theta P(T) - T: positive while the ballast would still warm up from T. */
  excessK(tK: number): number {
    return this.ambientK + this.thetaKPerW * this.powerW(tK) - tK;
  }

  /** The equilibrium by bisection from the surroundings (thermal.ts); always a stable one. */
  bisectK(): number {
    return selfHeatedTemperatureK(this.ambientK, this.thetaKPerW, (t) => this.powerW(t));
  }

  /**
   * The equilibrium at the operating point set, starting from `guessK` (the neighbouring rpm's
   * answer) with the neighbour's slope. Secant steps on g(T); the answer is accepted only where
   * the slope is negative, that is on a stable equilibrium (heating then grows more slowly than
   * the temperature). An iron ballast can have three equilibria at one point (a barretter's
   * fold, DEVELOPERS.md): the middle one is unstable and never returned. If the steps leave the
   * search range, meet a non-negative slope, or have not settled after 12 steps, bisection from
   * the surroundings decides. `this.slope` is left for the next point.
   */
  settle(guessK: number, guessSlope: number): number {
    const lo = this.ambientK;
    const hi = lo + SPAN_K;
    if (!(this.thetaKPerW > 0)) return lo;
    let t0 = guessK > lo && guessK < hi ? guessK : lo + 1;
    let g0 = this.excessK(t0);
    let s = guessSlope < 0 && Number.isFinite(guessSlope) ? guessSlope : -1;
    for (let k = 0; k < MAX_STEPS; k++) {
      const step = -g0 / s;
      if (!(Math.abs(step) > BALLAST_TOLERANCE_K)) {
        this.slope = s;
        this.refinedK = t0 + step;
        return t0;
      }
      // g(T_amb) >= 0 always (heating only adds), so a step below the surroundings stops there.
      const t1 = t0 + step < lo ? lo : t0 + step;
      if (!(t1 < hi) || t1 === t0) break;
      const g1 = this.excessK(t1);
      s = (g1 - g0) / (t1 - t0);
      if (!(s < 0)) break;
      t0 = t1;
      g0 = g1;
    }
    const t = this.bisectK();
    // The slope there, for the next point's first step.
    const d = 1e-3;
    const sl = (this.excessK(t + d) - this.excessK(t - d)) / (2 * d);
    this.slope = sl < 0 ? sl : -1;
    this.refinedK = t;
    this.powerW(t);
    return t;
  }
}
