/**
 * The secondary side of an inductive coil: the voltage it can reach, how fast, and how long the
 * spark lasts once the gap has broken down.
 */
import { inductorEnergyJ } from './charge.js';

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
 * What the secondary's series resistance (winding, lead, plug resistor) takes off the inductive
 * peak. After the break the secondary is a source-free series RLC (Ls, Rs, C) whose inductor starts
 * with the current at break over n and whose capacitor starts empty:
 * v(t) = (I0 / (C omega_d)) e^(-alpha t) sin(omega_d t), alpha = Rs / (2 Ls),
 * omega_d = sqrt(1/(Ls C) - alpha^2) (Alexander & Sadiku, Fundamentals of Electric Circuits,
 * ch. 8, source-free series RLC). Its first maximum is at t* = atan(omega_d / alpha) / omega_d, where
 * sin(omega_d t*) = omega_d / omega_0, so the peak is I0 sqrt(Ls / C) e^(-alpha t*): the lossless
 * peak times e^(-alpha t*). Critically damped: I0 / (C alpha e) against I0 sqrt(Ls/C); overdamped:
 * the peak of the two exponentials, as a fraction of the lossless peak. 1 without resistance.
 */
export function secondaryDampingFactor(seriesResistanceOhm: number, secondaryInductanceH: number, capacitanceF: number): number {
  if (!(seriesResistanceOhm > 0) || !(secondaryInductanceH > 0) || !(capacitanceF > 0)) return 1;
  const alpha = seriesResistanceOhm / (2 * secondaryInductanceH);
  const w0 = 1 / Math.sqrt(secondaryInductanceH * capacitanceF);
  const rel = (w0 - alpha) / w0;
  if (rel > 1e-6) {
    const wd = Math.sqrt(w0 * w0 - alpha * alpha);
    return Math.exp((-alpha * Math.atan(wd / alpha)) / wd);
  }
  // Per unit I0, against the lossless I0 sqrt(L/C) = I0 / (C w0).
  if (rel > -1e-6) return w0 / (alpha * Math.E);
  const root = Math.sqrt(alpha * alpha - w0 * w0);
  const s1 = -alpha + root;
  const s2 = -alpha - root;
  const t = Math.log(s2 / s1) / (s1 - s2);
  return (w0 * (Math.exp(s1 * t) - Math.exp(s2 * t))) / (s1 - s2);
}

/**
 * Energy an inductive spark delivers to the arc: the arc burns at V_arc while the secondary current
 * i(t) = (I0 + V_arc/Rs) e^(-Rs t / Ls) - V_arc / Rs falls to zero at the spark duration T
 * (`inductiveSparkDurationS`), so E = V_arc times the integral of i = (V_arc / Rs)(Ls I0 - V_arc T)
 * = (V_arc^2 Ls / Rs^2)(x - ln(1 + x)), x = Rs I0 / V_arc. The rest of 0.5 Ls I0^2 heats Rs. With
 * Rs -> 0 all of it reaches the arc. The glow-discharge phase carries most of an inductive spark's
 * energy (Heywood, Internal Combustion Engine Fundamentals, 1988, ch. 9, on the phases of a spark).
 */
export function inductiveSparkEnergyJ(secondaryInductanceH: number, seriesResistanceOhm: number, initialSecondaryA: number, arcV: number): number {
  return inductiveSparkEnergyGivenDurationJ(secondaryInductanceH, seriesResistanceOhm, initialSecondaryA, arcV, NaN);
}

/**
 * The same with the spark duration T already known (the sweep's column): then
 * E = (V_arc / Rs)(Ls I0 - V_arc T) needs no logarithm, except where x is small enough for the
 * subtraction to lose digits, where the series of x - ln(1 + x) is used.
 */
export function inductiveSparkEnergyGivenDurationJ(secondaryInductanceH: number, seriesResistanceOhm: number, initialSecondaryA: number, arcV: number, durationS: number): number {
  if (!(initialSecondaryA > 0) || !(arcV > 0)) return 0;
  const stored = inductorEnergyJ(secondaryInductanceH, initialSecondaryA);
  if (!(seriesResistanceOhm > 0)) return stored;
  const x = (seriesResistanceOhm * initialSecondaryA) / arcV;
  if (x >= 1e-2 && durationS === durationS) {
    return Math.min(stored, (arcV / seriesResistanceOhm) * (secondaryInductanceH * initialSecondaryA - arcV * durationS));
  }
  // x - ln(1 + x) = x^2/2 - x^3/3 + x^4/4 - ...: the series where the subtraction would lose digits.
  const f = x < 1e-2 ? x * x * (0.5 - x * (1 / 3 - x * (0.25 - x * (0.2 - x / 6)))) : x - Math.log1p(x);
  return Math.min(stored, ((arcV * arcV * secondaryInductanceH) / (seriesResistanceOhm * seriesResistanceOhm)) * f);
}
