/**
 * The secondary side of an inductive coil: the voltage it can reach, how fast, and how long the
 * spark lasts once the gap has broken down.
 */

/** Turns ratio from n if given, else sqrt(Ls / Lp) (both windings share one core). */
export function turnsRatio(n: number | null, secondaryInductanceH: number | null, primaryInductanceH: number): number {
  if (n !== null && n > 0) return n;
  if (secondaryInductanceH !== null && secondaryInductanceH > 0 && primaryInductanceH > 0) {
    return Math.sqrt(secondaryInductanceH / primaryInductanceH);
  }
  return 100;
}

/**
 * Capacitance the collapsing field charges, referred to the secondary. The condenser across the
 * points is reflected into the secondary as C/n^2, which is why it lowers the available voltage.
 */
export function effectiveSecondaryCapacitanceF(secondaryCapacitanceF: number, condenserF: number, n: number): number {
  return secondaryCapacitanceF + condenserF / (n * n);
}

/**
 * Available secondary voltage, lossless energy transfer: 0.5 Lp i^2 = 0.5 C_eff V^2 gives
 * V = i sqrt(Lp / C_eff), times the coil's transfer efficiency, capped by the module's primary
 * clamp reflected through the turns ratio (n x V_clamp).
 */
export function availableSecondaryV(currentA: number, voltsPerAmp: number, efficiency: number, capV: number): number {
  const v = currentA * voltsPerAmp * efficiency;
  return v < capV ? v : capV;
}

/** The secondary volts per primary amp of the lossless transfer, sqrt(Lp / C_eff). */
export function voltsPerAmp(primaryInductanceH: number, effectiveCapacitanceF: number): number {
  return Math.sqrt(primaryInductanceH / Math.max(1e-15, effectiveCapacitanceF));
}

/** Rise time of the secondary: about a quarter period of Ls with C, (pi/2) sqrt(Ls C). */
export function secondaryRiseTimeS(secondaryInductanceH: number, capacitanceF: number): number {
  return (Math.PI / 2) * Math.sqrt(Math.max(0, secondaryInductanceH * capacitanceF));
}

/**
 * Inductive spark duration: once the arc burns at V_arc the secondary current falls as the field
 * drains through V_arc and the series resistance, t = (Ls/Rs) ln(1 + Rs Is0 / V_arc), with
 * Is0 = eta i_break / n. With Rs -> 0 this tends to Ls Is0 / V_arc.
 */
export function inductiveSparkDurationS(secondaryInductanceH: number, seriesResistanceOhm: number, initialSecondaryA: number, arcV: number): number {
  if (!(initialSecondaryA > 0) || !(arcV > 0)) return 0;
  const x = (seriesResistanceOhm * initialSecondaryA) / arcV;
  if (!(seriesResistanceOhm > 1e-9)) return (secondaryInductanceH * initialSecondaryA) / arcV;
  return (secondaryInductanceH / seriesResistanceOhm) * Math.log1p(x);
}

/**
 * The points condenser and primary as a series RLC after the points open: the textbook damped
 * response (Alexander & Sadiku, Example 8.16). Returns alpha, the damped frequency and the first
 * extreme of the primary voltage about the supply, for a current `i0` flowing at opening.
 * v(t) = Vs - (i0 / (C wd)) e^(-alpha t) sin(wd t) when starting with the capacitor at the supply.
 */
export interface SeriesRlcResponse {
  alphaPerS: number;
  dampedOmegaRadPerS: number;
  firstPeakS: number;
  /** First extreme of the primary voltage relative to the supply (negative: below it). */
  firstPeakV: number;
}

export function seriesRlcOpening(resistanceOhm: number, inductanceH: number, capacitanceF: number, i0A: number): SeriesRlcResponse {
  const alpha = resistanceOhm / (2 * inductanceH);
  const w0sq = 1 / (inductanceH * capacitanceF);
  const wd = Math.sqrt(Math.max(0, w0sq - alpha * alpha));
  if (!(wd > 0)) return { alphaPerS: alpha, dampedOmegaRadPerS: 0, firstPeakS: 0, firstPeakV: 0 };
  // d/dt [e^(-at) sin(wt)] = 0 at tan(wt) = w/a.
  const t = Math.atan2(wd, alpha) / wd;
  const v = -(i0A / (capacitanceF * wd)) * Math.exp(-alpha * t) * Math.sin(wd * t);
  return { alphaPerS: alpha, dampedOmegaRadPerS: wd, firstPeakS: t, firstPeakV: v };
}
