/**
 * Breakdown voltage of the plug gap.
 *
 * Used: the empirical air formula V_kV = 24.22 x + 6.08 sqrt(x), with x the density-reduced gap
 * x = gap_cm (p / 760 Torr)(293 K / T). It fits gaps of millimetres at and above one atmosphere:
 * 1 cm at 1 atm gives 30.3 kV (about 30 kV published), 1 mm gives 4.34 kV.
 *
 * Cross-check: Paschen's law V = B pd / (ln(A pd) - ln(ln(1 + 1/gamma))) with A = 15 /(cm Torr),
 * B = 365 V/(cm Torr), gamma = 0.01 reads about 17 % high in this range; it is kept for the
 * low-pressure end and as a second opinion.
 */

export const ATM_PA = 101_325;
export const REFERENCE_TEMPERATURE_K = 293;

/** Density-reduced gap in cm: gap_cm x (p / 1 atm) x (293 K / T). */
export function reducedGapCm(gapM: number, pressurePa: number, temperatureK: number): number {
  return gapM * 100 * (pressurePa / ATM_PA) * (REFERENCE_TEMPERATURE_K / Math.max(1, temperatureK));
}

/** Empirical air breakdown, volts, for a density-reduced gap in cm. */
export function airBreakdownV(reducedCm: number): number {
  const x = Math.max(0, reducedCm);
  return 1000 * (24.22 * x + 6.08 * Math.sqrt(x));
}

const PASCHEN_A = 15; // 1 / (cm Torr)
const PASCHEN_B = 365; // V / (cm Torr)
const PASCHEN_GAMMA = 0.01;
const LN_LN = Math.log(Math.log(1 + 1 / PASCHEN_GAMMA));
/** pd at the Paschen minimum, where ln(A pd) = 1 + ln(ln(1 + 1/gamma)). */
const PD_MIN = Math.exp(1 + LN_LN) / PASCHEN_A;

/**
 * Paschen breakdown, volts, for a (density-reduced) pd in Torr cm. Left of the minimum the formula
 * climbs to infinity at ln(A pd) = ln(ln(1 + 1/gamma)); we return the minimum voltage there so the
 * result stays finite (it then understates the need; spark plugs never operate there).
 */
export function paschenBreakdownV(pdTorrCm: number): number {
  const pd = Math.max(pdTorrCm, PD_MIN);
  return (PASCHEN_B * pd) / (Math.log(PASCHEN_A * pd) - LN_LN);
}

/** Paschen breakdown for a reduced gap in cm (at 760 Torr equivalent). */
export function paschenBreakdownFromReducedV(reducedCm: number): number {
  return paschenBreakdownV(Math.max(0, reducedCm) * 760);
}

/**
 * Centre-electrode polarity: a negative (hot, emitting) centre electrode needs roughly 10 % less
 * voltage than a positive one (club technical literature; more when hot, from memory). We treat the
 * breakdown formulas as the correctly wired (negative centre) requirement and a reversed coil as
 * needing 1 / 0.9 of it, which is the cautious reading.
 */
export const REVERSED_POLARITY_FACTOR = 1 / 0.9;
