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
  return meanSquareGivenLimitTimeA2(finalA, tauS, dwellS, periodS, limitA, limitA < finalA && tauS > 0 ? timeToReachS(finalA, tauS, limitA) : Infinity);
}

/**
 * The same with the time to reach the limit already known (`timeToReachS`). Up to the limit
 * 1 - e^(-t_l/tau) is I_lim / I_final by definition, and 1 - e^(-2x) = (1 - e^(-x))(2 - (1 - e^(-x))),
 * so at most one exponential is needed (the ballast solution calls this at every rpm).
 */
export function meanSquareGivenLimitTimeA2(finalA: number, tauS: number, dwellS: number, periodS: number, limitA: number, toLimitS: number): number {
  return meanSquareWithChargeA2(finalA, tauS, dwellS, periodS, limitA, toLimitS, NaN);
}

/**
 * The same, given also 1 - e^(-t_d/tau) for the whole dwell when the caller has it already (NaN
 * when not): the ballast solution forms it for the current at break and should not pay for it twice.
 */
export function meanSquareWithChargeA2(finalA: number, tauS: number, dwellS: number, periodS: number, limitA: number, toLimitS: number, chargedFraction: number): number {
  if (!(periodS > 0) || !(dwellS > 0) || !(finalA > 0)) return 0;
  const td = Math.min(dwellS, periodS);
  let ramp = td;
  let held = 0;
  let limited = false;
  if (limitA < finalA && tauS > 0 && toLimitS < td) {
    ramp = toLimitS;
    held = td - toLimitS;
    limited = true;
  }
  let integral: number;
  if (tauS > 0) {
    const e1 = limited ? limitA / finalA : ramp === dwellS && chargedFraction === chargedFraction ? chargedFraction : -Math.expm1(-ramp / tauS);
    const e2 = e1 * (2 - e1);
    integral = finalA * finalA * Math.max(0, ramp - 2 * tauS * e1 + 0.5 * tauS * e2);
  } else {
    integral = finalA * finalA * ramp;
  }
  const lim = Math.min(limitA, finalA);
  integral += lim * lim * held;
  return integral / periodS;
}
