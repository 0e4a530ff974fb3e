/**
 * Iron-wire ballast self-heating. Iron's resistivity climbs steeply with temperature, so a ballast
 * that runs hot passes less current: it protects a low-resistance coil at idle and key-on, and
 * relaxes when the current is brief (high rpm). A linear alpha of 0.005 /K under-predicts this
 * badly at several hundred degrees, so we interpolate a resistivity table instead.
 */

/**
 * Resistivity of pure iron, micro-ohm cm, against kelvin. Handbook pure-metal table values as
 * remembered (from memory): 9.98 / 16.1 / 23.7 / 32.9 at 300 / 400 / 500 / 600 K, continuing to
 * about 1000 K (near the Curie point, where the slope eases). Beyond the table we extend linearly
 * with the last slope.
 */
export const IRON_RESISTIVITY_TABLE: ReadonlyArray<readonly [number, number]> = [
  [200, 5.2],
  [273, 8.57],
  [293, 9.61],
  [300, 9.98],
  [400, 16.1],
  [500, 23.7],
  [600, 32.9],
  [700, 44.0],
  [800, 57.1],
  [900, 72.4],
  [1000, 87.0],
  [1100, 103.0],
  [1200, 112.0],
];

// The same table as two flat columns: the ballast heating solution reads it thousands of times.
const TABLE_K = Float64Array.from(IRON_RESISTIVITY_TABLE, (row) => row[0]);
const TABLE_RHO = Float64Array.from(IRON_RESISTIVITY_TABLE, (row) => row[1]);
// Slope of each segment (row i-1 to row i), so a lookup multiplies instead of dividing.
const TABLE_SLOPE = Float64Array.from(IRON_RESISTIVITY_TABLE, (row, i) => (i === 0 ? 0 : (row[1] - IRON_RESISTIVITY_TABLE[i - 1]![1]) / (row[0] - IRON_RESISTIVITY_TABLE[i - 1]![0])));

/** Iron resistivity at a temperature, by linear interpolation (linear extension past the ends). */
export function ironResistivityMicroOhmCm(temperatureK: number): number {
  const n = TABLE_K.length;
  let i = 1;
  // From 300 K up the rows are 100 K apart: go straight to the row the walk below would reach.
  if (temperatureK > 300) i = Math.min(n - 1, 3 + Math.ceil((temperatureK - 300) / 100));
  else while (i < n - 1 && temperatureK > TABLE_K[i]!) i++;
  const r = TABLE_RHO[i - 1]! + TABLE_SLOPE[i]! * (temperatureK - TABLE_K[i - 1]!);
  return r > 0.5 ? r : 0.5;
}

const PER_RHO_20C = 1 / ironResistivityMicroOhmCm(293.15);

/** Resistance of an iron-wire ballast at a temperature, from its 20 degC value. */
export function ironBallastResistanceOhm(cold20COhm: number, temperatureK: number): number {
  return cold20COhm * ironResistivityMicroOhmCm(temperatureK) * PER_RHO_20C;
}

/**
 * Equilibrium temperature of a self-heated resistor: solve T = T_amb + theta * P(T) by bisection.
 * g(T) = T_amb + theta P(T) - T is positive at T_amb (heating only adds) and negative far above
 * (resistance so high the current dies away), so bisection always brackets a root.
 */
export function selfHeatedTemperatureK(ambientK: number, thetaKPerW: number, powerAtW: (temperatureK: number) => number): number {
  let lo = ambientK;
  let hi = ambientK + 1500;
  if (!(excessK(ambientK, thetaKPerW, powerAtW, lo) > 0)) return ambientK;
  if (excessK(ambientK, thetaKPerW, powerAtW, hi) > 0) return hi;
  // 40 halvings of 1500 K leave about 1e-9 K.
  for (let k = 0; k < 40; k++) {
    const mid = 0.5 * (lo + hi);
    if (excessK(ambientK, thetaKPerW, powerAtW, mid) > 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/** g(T) = T_amb + theta P(T) - T: positive while the resistor would still heat up from T. */
function excessK(ambientK: number, thetaKPerW: number, powerAtW: (temperatureK: number) => number, t: number): number {
  return ambientK + thetaKPerW * powerAtW(t) - t;
}
