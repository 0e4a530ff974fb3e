/**
 * A fouled plug: carbon on the insulator nose is a resistance across the gap. The secondary is
 * then a parallel RLC (Ls, C, R_shunt) whose inductor starts with i_break / n and whose capacitor
 * starts empty. The first voltage peak has a closed form; with a low shunt it never reaches the
 * breakdown voltage and the plug does not fire. A fast-rising CD spark loses less to the shunt.
 */

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
