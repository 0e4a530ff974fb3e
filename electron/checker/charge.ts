/**
 * Inductive charge of the coil primary: an RL step. The current climbs as
 * i(t) = I_final (1 - exp(-t / tau)), tau = L / R, reaching 95 % at 3 tau. The energy handed to the
 * secondary at break is what the magnetic field holds, 0.5 L i^2.
 */

/** Current after charging for `tS` with time constant `tauS` towards `finalA`. */
export function chargeCurrentA(finalA: number, tauS: number, tS: number): number {
  if (!(finalA > 0) || !(tS > 0)) return 0;
  if (!(tauS > 0)) return finalA;
  // -expm1(-x) = 1 - exp(-x), accurate for short dwell times.
  return finalA * -Math.expm1(-tS / tauS);
}

/** Time for the current to reach `targetA`; Infinity when the final current never gets there. */
export function timeToReachS(finalA: number, tauS: number, targetA: number): number {
  if (!(targetA > 0)) return 0;
  if (!(targetA < finalA)) return Infinity;
  return -tauS * Math.log1p(-targetA / finalA);
}

/** Energy in an inductor: 0.5 L i^2. */
export function inductorEnergyJ(inductanceH: number, currentA: number): number {
  return 0.5 * inductanceH * currentA * currentA;
}

/**
 * Mean of i^2 over one firing period when the coil charges for `dwellS` out of `periodS` and
 * carries nothing while open. Integral of (1 - e^(-t/tau))^2 from 0 to td:
 * td - 2 tau (1 - e^(-td/tau)) + (tau/2)(1 - e^(-2 td/tau)). Used for the ballast's heating.
 * A current limit caps the ramp: after it is reached the current is held at the limit.
 */
export function meanSquareCurrentA2(finalA: number, tauS: number, dwellS: number, periodS: number, limitA: number): number {
  return meanSquareGivenLimitTimeA2(finalA, tauS, dwellS, periodS, limitA, timeToReachS(finalA, tauS, limitA));
}

/**
 * The same with the time to reach the limit already known (`timeToReachS`: Infinity when the limit
 * is at or above the final current, so it is never reached). Up to the limit 1 - e^(-t_l/tau) is
 * I_lim / I_final by definition, and 1 - e^(-2x) = (1 - e^(-x))(2 - (1 - e^(-x))), so at most one
 * exponential is needed (the ballast solution calls this at every rpm).
 */
export function meanSquareGivenLimitTimeA2(finalA: number, tauS: number, dwellS: number, periodS: number, limitA: number, toLimitS: number): number {
  return meanSquareWithChargeA2(finalA, tauS, dwellS, periodS, limitA, toLimitS, NaN);
}

/**
 * The same, given also 1 - e^(-t_d/tau) for the whole dwell when the caller has it already (NaN
 * when not): the ballast solution forms it for the current at break and should not pay for it twice.
 * A dwell longer than the period charges for the whole period.
 */
export function meanSquareWithChargeA2(finalA: number, tauS: number, dwellS: number, periodS: number, limitA: number, toLimitS: number, chargedFraction: number): number {
  if (!(periodS > 0) || !(dwellS > 0) || !(finalA > 0)) return 0;
  const td = Math.min(dwellS, periodS);
  const held = Math.min(limitA, finalA);
  // Without inductance the current stands at its final value (or the limit) for the whole dwell.
  if (!(tauS > 0)) return (held * held * td) / periodS;
  let ramp = td;
  let e1: number;
  if (toLimitS < td) {
    ramp = toLimitS;
    e1 = limitA / finalA;
  } else {
    e1 = td === dwellS && chargedFraction === chargedFraction ? chargedFraction : -Math.expm1(-td / tauS);
  }
  const e2 = e1 * (2 - e1);
  const rampIntegral = finalA * finalA * Math.max(0, ramp - 2 * tauS * e1 + 0.5 * tauS * e2);
  return (rampIntegral + held * held * (td - ramp)) / periodS;
}
