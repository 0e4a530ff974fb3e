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
 * The fast transfer loop of a CD firing, primary-referred: the capacitor C (charged to V) rings
 * through the coil's leakage inductance and the loop resistance into the reflected secondary
 * capacitance n^2 Cs (the magnetizing inductance, about 100 times the leakage, barely moves in
 * that time and is left out). `loopOhm` is R_p + R_s / n^2 (the primary winding at its working
 * temperature, and the secondary winding, lead and plug resistor reflected); `leakageH` is
 * 2 (1 - k) Lp.
 */
export interface CdTransferLoop {
  loopOhm: number;
  leakageH: number;
}

/**
 * Leakage inductance of a coupled coil, primary-referred: with L1 = Lp, L2 = n^2 Lp and
 * M = k n Lp the T-equivalent through the turns ratio n has (1 - k) Lp on each side, 2 (1 - k) Lp
 * in all (the T equivalent of coupled coils, Alexander & Sadiku, Fundamentals of Electric
 * Circuits, ch. 13, referred through the turns ratio; chapter from memory).
 */
export function leakageInductanceH(primaryInductanceH: number, couplingK: number): number {
  return 2 * (1 - couplingK) * primaryInductanceH;
}

/**
 * Damping ratio of the transfer loop, a series RLC with C in series with n^2 Cs:
 * zeta = (R / 2) sqrt(C_ser / L_leak), C_ser = C n^2 Cs / (C + n^2 Cs). Infinity without leakage
 * (an RC loop), 0 without resistance.
 */
export function cdTransferDampingRatio(capacitanceF: number, n: number, secondaryCapacitanceF: number, loop: CdTransferLoop): number {
  const reflected = n * n * secondaryCapacitanceF;
  const series = (capacitanceF * reflected) / (capacitanceF + reflected);
  if (!(loop.loopOhm > 0)) return 0;
  if (!(loop.leakageH > 0)) return Infinity;
  return 0.5 * loop.loopOhm * Math.sqrt(series / loop.leakageH);
}

/**
 * How far the reflected capacitor's voltage overshoots its charge-sharing value: the step
 * response of a series RLC, v = V_cm (1 - e^(-alpha t)(cos wd t + (alpha / wd) sin wd t)), has its
 * first maximum at wd t = pi, V_cm (1 + exp(-pi zeta / sqrt(1 - zeta^2))). At zeta >= 1 the
 * response rises monotonically towards V_cm and never overshoots (factor 0; continuous at 1).
 */
export function cdOvershootFraction(zeta: number): number {
  if (!(zeta < 1)) return 0;
  if (!(zeta > 0)) return 1;
  return Math.exp((-Math.PI * zeta) / Math.sqrt(1 - zeta * zeta));
}

/**
 * Secondary peak from resonant charge transfer into the reflected secondary capacitance n^2 Cs.
 * Charge sharing leaves both capacitors at V_cm = C V / (C + n^2 Cs); the transfer loop overshoots
 * that by the fraction above, so the primary-referred peak is V_cm (1 + overshoot), which without
 * loss (zeta = 0) is the familiar 2 C V / (C + n^2 Cs). Times n for the secondary, times the
 * coil's transfer efficiency for the losses this loop does not draw (the core; see conditions.ts).
 * Without `loop` the transfer is lossless.
 */
export function cdSecondaryPeakV(capacitanceF: number, chargeV: number, n: number, secondaryCapacitanceF: number, efficiency: number, loop?: CdTransferLoop): number {
  const reflected = n * n * secondaryCapacitanceF;
  const shared = (capacitanceF * chargeV) / (capacitanceF + reflected);
  const overshoot = loop ? cdOvershootFraction(cdTransferDampingRatio(capacitanceF, n, secondaryCapacitanceF, loop)) : 1;
  return n * efficiency * shared * (1 + overshoot);
}

/**
 * CD spark duration: the capacitor rings with the coil primary; the spark lasts about half a
 * period of that ring, pi sqrt(Lp C) (our model; it lands in the 0.1 to 0.3 ms range remembered
 * for CD sparks).
 */
export function cdSparkDurationS(primaryInductanceH: number, capacitanceF: number): number {
  return Math.PI * Math.sqrt(Math.max(0, primaryInductanceH * capacitanceF));
}

/**
 * Secondary rise time of a CD firing: the time the transfer loop takes to its first peak. For an
 * underdamped series RLC driven by a step that is the peak time t_p = pi / omega_d,
 * omega_d = omega_0 sqrt(1 - zeta^2), omega_0 = 1 / sqrt(L_leak C_ser) (Ogata, Modern Control
 * Engineering, and Nise, Control Systems Engineering: peak time of the second-order step
 * response). At zeta >= 1 there is no peak: the response creeps up to V_cm, and we take 95 % of
 * it, three time constants of the slow root s = -omega_0 (zeta - sqrt(zeta^2 - 1)) (our model).
 * Without leakage (an RC loop) the time is 3 R C_ser; with neither, 0.
 */
export function cdRiseTimeS(capacitanceF: number, n: number, secondaryCapacitanceF: number, loop: CdTransferLoop): number {
  const reflected = n * n * secondaryCapacitanceF;
  const series = (capacitanceF * reflected) / (capacitanceF + reflected);
  if (!(series > 0)) return 0;
  if (!(loop.leakageH > 0)) return 3 * Math.max(0, loop.loopOhm) * series;
  const w0 = 1 / Math.sqrt(loop.leakageH * series);
  const zeta = cdTransferDampingRatio(capacitanceF, n, secondaryCapacitanceF, loop);
  if (zeta < 1) return Math.PI / (w0 * Math.sqrt(1 - zeta * zeta));
  // zeta - sqrt(zeta^2 - 1) written as 1 / (zeta + sqrt(zeta^2 - 1)) (the two roots multiply to
  // omega_0^2): the difference loses every digit at large zeta, the sum none.
  return (3 * (zeta + Math.sqrt(zeta * zeta - 1))) / w0;
}

/**
 * Energy a CD firing delivers to the spark over its modelled duration (half a ring period of the
 * capacitor with the coil primary, `cdSparkDurationS`). Referred to the primary the arc is a
 * constant counter-voltage V_a = V_arc / n; a lossless LC with a constant counter-voltage swings
 * the capacitor from V to 2 V_a - V in that half period, so the charge through the arc is
 * 2 C (V - V_a) and the energy V_a 2 C (V - V_a) (our model), times the transfer efficiency (the
 * current it delivers). Nothing is delivered when V is at or below V_a.
 */
export function cdSparkEnergyJ(capacitanceF: number, chargeV: number, n: number, arcV: number, efficiency: number): number {
  const va = arcV / Math.max(1e-9, n);
  if (!(chargeV > va) || !(capacitanceF > 0)) return 0;
  return efficiency * va * 2 * capacitanceF * (chargeV - va);
}

/**
 * Charger recharge time and the rpm above which the capacitor no longer fills: the firing period
 * falls below 0.5 C V^2 / P at rpm = 60 k / (cylinders T_rech), k = 2 on a four-stroke and 1 on a
 * two-stroke (sparks per revolution cylinders / k).
 */
export function cdEnergyFallsFromRpm(capacitanceF: number, chargeV: number, chargerPowerW: number, cylinders: number, twoStroke: boolean): number {
  const t = rechargeTimeS(capacitanceF, chargeV, chargerPowerW);
  if (!(t > 0) || !Number.isFinite(t)) return t > 0 ? 0 : Infinity;
  return (60 * (twoStroke ? 1 : 2)) / (Math.max(1, cylinders) * t);
}
