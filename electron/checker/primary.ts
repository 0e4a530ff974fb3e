/**
 * Primary circuit resistances and the steady current with the switch closed.
 */

/** Temperature coefficient of annealed copper at 20 degC (IACS), per kelvin. */
export const COPPER_ALPHA_PER_K = 0.00393;

/**
 * Copper winding resistance at a temperature: R(T) = R20 (1 + 0.00393 (T - 20)). This is the same
 * law as R2/R1 = (234.5 + T2)/(234.5 + T1) for annealed copper; at 80 degC it gives 1.2358 x R20.
 * A hot coil therefore draws less current than its cold reading suggests.
 */
export function copperResistanceOhm(r20Ohm: number, temperatureC: number): number {
  // Below about -234 degC the linear law would go negative; a coil is never there, but stay finite.
  return r20Ohm * Math.max(0.05, 1 + COPPER_ALPHA_PER_K * (temperatureC - 20));
}

/** Inverse of the copper law: the 20 degC value of a winding read at `temperatureC`. */
export function copperResistanceAt20COhm(readOhm: number, temperatureC: number): number {
  return readOhm / Math.max(0.05, 1 + COPPER_ALPHA_PER_K * (temperatureC - 20));
}

/**
 * Steady current with the switch closed: what the coil settles to given time, I = (V - V_switch)/R.
 * Never negative, and zero when there is no resistance to speak of (an invalid circuit, which the
 * rules report rather than dividing by zero).
 */
export function finalCurrentA(supplyV: number, switchDropV: number, totalResistanceOhm: number): number {
  const drive = supplyV - switchDropV;
  if (!(drive > 0) || !(totalResistanceOhm > 1e-6)) return 0;
  return drive / totalResistanceOhm;
}
