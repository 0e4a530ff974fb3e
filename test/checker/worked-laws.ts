/**
 * Laws and tables the checker tests work their expected values from, written once here, never
 * taken from the code under test:
 * - the empirical air breakdown law V = 1000 (24.22 x + 6.08 sqrt x) volts, x the density-reduced gap
 *   in cm (about 30 kV for 1 cm at 1 atm, published; as documented in breakdown.ts);
 * - Paschen's law V = B pd / (ln(A pd) - ln(ln(1 + 1/gamma))), A = 15 /(cm Torr), B = 365 V/(cm Torr),
 *   gamma = 0.01, at pd = 760 x Torr cm, held at its minimum left of it (breakdown.ts's constants);
 * - Simpson's rule (Burden & Faires, Numerical Analysis, sec. 4.3);
 * - iron's resistivity against temperature (the checker's table, from memory, restated), linearly
 *   interpolated;
 * - a hand-made rpm grid holding only the columns a test gives (the rest zero).
 */
import type { RpmGrid } from '../../electron/checker/grid.js';

/** Empirical air breakdown, volts, x the reduced gap in cm. */
export const airV = (x: number): number => 1000 * (24.22 * x + 6.08 * Math.sqrt(x));

const LN_LN = Math.log(Math.log(1 + 1 / 0.01));
const PD_MIN = Math.exp(1 + LN_LN) / 15;
/** Paschen's law, volts, for a reduced gap x in cm (pd = 760 x Torr cm), held at its minimum left of it. */
export const paschenV = (x: number): number => {
  const pd = Math.max(760 * x, PD_MIN);
  return (365 * pd) / (Math.log(15 * pd) - LN_LN);
};

/** Simpson's rule over [a, b] with n (even) intervals; 0 for an empty interval. */
export function simpson(f: (t: number) => number, a: number, b: number, n = 20_000): number {
  if (!(b > a)) return 0;
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let k = 1; k < n; k++) s += (k % 2 === 1 ? 4 : 2) * f(a + k * h);
  return (s * h) / 3;
}

/** Iron resistivity, micro-ohm cm, against kelvin (the code's table, from memory, restated). */
export const IRON: ReadonlyArray<readonly [number, number]> = [
  [200, 5.2], [273, 8.57], [293, 9.61], [300, 9.98], [400, 16.1], [500, 23.7], [600, 32.9], [700, 44.0],
  [800, 57.1], [900, 72.4], [1000, 87.0], [1100, 103.0], [1200, 112.0],
];
/** Iron's resistivity at T by linear interpolation in the table (extended along its end rows). */
export function ironRho(t: number): number {
  let i = 1;
  while (i < IRON.length - 1 && t > IRON[i]![0]) i++;
  const [t0, r0] = IRON[i - 1]!;
  const [t1, r1] = IRON[i]!;
  return r0 + ((r1 - r0) * (t - t0)) / (t1 - t0);
}

/** A hand-made grid: the given rpm and density factors (their lengths agree), every other column zero. */
export function gridOf(columns: { rpm?: readonly number[]; densityFactor?: readonly number[] }): RpmGrid {
  const n = (columns.rpm ?? columns.densityFactor ?? []).length;
  const z = (): Float64Array => new Float64Array(n);
  return {
    n, rpm: columns.rpm ? Float64Array.from(columns.rpm) : z(), cranking: new Uint8Array(n), resting: new Uint8Array(n), sparkRateHz: z(), periodS: z(),
    sparkAngleDegBtdc: z(), pressurePa: z(), temperatureK: z(), densityFactor: columns.densityFactor ? Float64Array.from(columns.densityFactor) : z(),
  };
}
