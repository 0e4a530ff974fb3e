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
  if (!(periodS > 0) || !(dwellS > 0) || !(finalA > 0)) return 0;
  const td = Math.min(dwellS, periodS);
  let ramp = td;
  let held = 0;
  if (limitA < finalA && tauS > 0) {
    const tl = timeToReachS(finalA, tauS, limitA);
    if (tl < td) {
      ramp = tl;
      held = td - tl;
    }
  }
  let integral: number;
  if (tauS > 0) {
    const e1 = -Math.expm1(-ramp / tauS);
    const e2 = -Math.expm1((-2 * ramp) / tauS);
    integral = finalA * finalA * Math.max(0, ramp - 2 * tauS * e1 + 0.5 * tauS * e2);
  } else {
    integral = finalA * finalA * ramp;
  }
  const lim = Math.min(limitA, finalA);
  integral += lim * lim * held;
  return integral / periodS;
}
