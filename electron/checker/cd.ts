/**
 * Capacitive discharge: a capacitor charged to a few hundred volts is dumped into the coil primary.
 * The energy is 0.5 C V^2 (1 uF at 400 V is 80 mJ) and does not depend on dwell, but a charger of
 * limited power cannot refill the capacitor when sparks come too fast.
 */

/** Energy in a capacitor, 0.5 C V^2. */
export function capacitorEnergyJ(capacitanceF: number, voltageV: number): number {
  return 0.5 * capacitanceF * voltageV * voltageV;
}

/** Time the charger needs to refill the capacitor, 0.5 C V^2 / P. */
export function rechargeTimeS(capacitanceF: number, voltageV: number, chargerPowerW: number): number {
  return chargerPowerW > 0 ? capacitorEnergyJ(capacitanceF, voltageV) / chargerPowerW : Infinity;
}

/**
 * Charge voltage reached in a firing period. Below the minimum supply the converter's output falls
 * in proportion (from memory); below its cut-out it stops. When the period is shorter than the
 * recharge time the capacitor only gets P T of energy: V = sqrt(2 P T / C).
 */
export function cdChargeVoltageV(nominalV: number, capacitanceF: number, chargerPowerW: number, periodS: number, supplyV: number, supplyMinV: number, cutOutV: number): number {
  if (!(supplyV > cutOutV) || !(periodS > 0)) return 0;
  let v = nominalV;
  if (supplyV < supplyMinV && supplyMinV > 0) v = (nominalV * supplyV) / supplyMinV;
  const limited = Math.sqrt((2 * chargerPowerW * periodS) / Math.max(1e-12, capacitanceF));
  return v < limited ? v : limited;
}

/**
 * Secondary peak from resonant charge transfer into the reflected secondary capacitance n^2 Cs:
 * the ideal primary peak is 2 C V / (C + n^2 Cs) (charge sharing in a lossless LC), times n for the
 * secondary, times a transfer efficiency.
 */
export function cdSecondaryPeakV(capacitanceF: number, chargeV: number, n: number, secondaryCapacitanceF: number, efficiency: number): number {
  const reflected = n * n * secondaryCapacitanceF;
  return (n * efficiency * 2 * capacitanceF * chargeV) / (capacitanceF + reflected);
}

/**
 * CD spark duration: the capacitor rings with the coil primary; the spark lasts about half a
 * period of that ring, pi sqrt(Lp C) (our model; it lands in the 0.1 to 0.3 ms range remembered
 * for CD sparks).
 */
export function cdSparkDurationS(primaryInductanceH: number, capacitanceF: number): number {
  return Math.PI * Math.sqrt(Math.max(0, primaryInductanceH * capacitanceF));
}
