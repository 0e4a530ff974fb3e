/**
 * A fouled plug: carbon on the insulator nose is a resistance across the gap. The secondary is
 * then a parallel RLC (Ls, C, R_shunt) whose inductor starts with the flux current at break over n
 * and whose capacitor starts empty. The first voltage peak has a closed form; with a low shunt it
 * never reaches the breakdown voltage and the plug does not fire. A fast-rising CD spark loses
 * less to the shunt.
 *
 * The shunt is there during the dwell too: the secondary then drives current through it, and part
 * of the primary current feeds that instead of building flux, so a fouled coil charges more
 * slowly. That is what the charge functions below work out.
 */
import { chargeCurrentA } from './charge.js';

/**
 * The shunt seen from the primary: the shunt and the secondary series resistance (winding, lead,
 * plug resistor) in series, reflected through the turns ratio, (R_shunt + R_s) / n^2. It sits
 * across the primary inductance (ideal transformer referral).
 */
export function reflectedShuntOhm(shuntOhm: number, secondarySeriesOhm: number, n: number): number {
  return (shuntOhm + secondarySeriesOhm) / (n * n);
}

/**
 * Charging time constant of the flux with the shunt across Lp. Thevenin equivalent seen by Lp:
 * V_th = V' R_sh / (R + R_sh), R_th = R R_sh / (R + R_sh), so the flux current's final value
 * V_th / R_th = V' / R is the clean final current (at DC the inductance shorts the shunt), and
 * its time constant is Lp / R_th = tau (1 + R / R_sh). An infinite shunt gives tau back.
 */
export function fouledChargeTauS(tauS: number, primaryOhm: number, reflectedOhm: number): number {
  return tauS * (1 + primaryOhm / reflectedOhm);
}

/**
 * Time for the total primary current to reach a current limit while the fouled coil charges. The
 * total is the flux current plus the shunt branch's v_L / R_sh:
 * i_p(t) = I_final (1 - (R_sh / (R + R_sh)) e^(-t / tau_f)), which starts at V' / (R + R_sh)
 * rather than at zero. A limiter holds the total (it sits in the primary's one loop), so this is
 * when it takes over; 0 when the shunt alone draws the limit, Infinity when it is never reached.
 */
export function fouledTimeToLimitS(finalA: number, tauFouledS: number, primaryOhm: number, reflectedOhm: number, limitA: number): number {
  if (!(limitA < finalA)) return Infinity;
  if (!(limitA > 0)) return 0;
  const x = (1 - limitA / finalA) * (1 + primaryOhm / reflectedOhm);
  if (!(x < 1)) return 0;
  return -tauFouledS * Math.log(x);
}

/**
 * Flux current at break on a fouled plug, the current the secondary inherits (times 1 / n).
 * Before the limit: I_final (1 - e^(-t / tau_f)). Once the limiter holds the total at I_lim the
 * flux current still climbs, i_f + (Lp / R_sh) di_f/dt = I_lim, towards I_lim with time constant
 * `holdTauS` = Lp / R_sh. With no shunt (R_sh infinite: tau_f = tau, hold time constant 0) this is
 * min(I_final (1 - e^(-t / tau)), I_lim), the clean break current.
 */
export function fouledFluxCurrentA(finalA: number, tauFouledS: number, dwellS: number, limitA: number, toLimitS: number, holdTauS: number): number {
  if (!(dwellS > toLimitS)) return chargeCurrentA(finalA, tauFouledS, dwellS);
  const atLimit = chargeCurrentA(finalA, tauFouledS, toLimitS);
  if (!(holdTauS > 0)) return limitA;
  return limitA - (limitA - atLimit) * Math.exp(-(dwellS - toLimitS) / holdTauS);
}

/**
 * First voltage peak per ampere of initial inductor current, parallel RLC. alpha = 1/(2RC),
 * w0 = 1/sqrt(LC).
 * - Underdamped: v = (I0 / (C wd)) e^(-alpha t) sin(wd t); peak at tan(wd t) = wd / alpha, where
 *   sin = wd / w0, so v_peak = I0 sqrt(L/C) e^(-alpha t*).
 * - Critically damped: v = (I0 / C) t e^(-alpha t), peak I0 / (C alpha e) at t = 1/alpha.
 * - Overdamped: v = I0 / (C (s1 - s2)) (e^(s1 t) - e^(s2 t)), peak at t* = ln(s2/s1) / (s1 - s2).
 * As R -> infinity this tends to the lossless I0 sqrt(L/C).
 */
export function parallelRlcPeakVPerA(inductanceH: number, capacitanceF: number, shuntOhm: number): number {
  if (!(inductanceH > 0) || !(capacitanceF > 0)) return 0;
  const lossless = Math.sqrt(inductanceH / capacitanceF);
  if (!(shuntOhm > 0)) return 0;
  if (!Number.isFinite(shuntOhm)) return lossless;
  const alpha = 1 / (2 * shuntOhm * capacitanceF);
  const w0 = 1 / Math.sqrt(inductanceH * capacitanceF);
  const rel = (w0 - alpha) / w0;
  if (rel > 1e-6) {
    const wd = Math.sqrt(w0 * w0 - alpha * alpha);
    const t = Math.atan2(wd, alpha) / wd;
    return lossless * Math.exp(-alpha * t);
  }
  if (rel > -1e-6) return 1 / (capacitanceF * alpha * Math.E);
  const root = Math.sqrt(alpha * alpha - w0 * w0);
  const s1 = -alpha + root;
  const s2 = -alpha - root;
  const t = Math.log(s2 / s1) / (s1 - s2);
  return (Math.exp(s1 * t) - Math.exp(s2 * t)) / (capacitanceF * (s1 - s2));
}

/**
 * CD into a fouled plug: the secondary charges in about `riseS`; over that time the shunt bleeds
 * charge with time constant tau = R C. Treating the charging as a constant current pulse, the peak
 * reached is a fraction (tau / t_r)(1 - e^(-t_r / tau)) of the clean peak (our model).
 */
export function cdFouledFraction(riseS: number, shuntOhm: number, capacitanceF: number): number {
  const tau = shuntOhm * capacitanceF;
  if (!(tau > 0)) return 0;
  if (!(riseS > 0)) return 1;
  const x = riseS / tau;
  return -Math.expm1(-x) / x;
}
