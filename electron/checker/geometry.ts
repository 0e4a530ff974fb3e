/**
 * Cylinder volume against crank angle: the slider-crank (Heywood, Internal Combustion Engine
 * Fundamentals, 1988, section 2.2).
 * V / V_c = 1 + (r_c - 1)/2 * (R + 1 - cos(theta) - sqrt(R^2 - sin^2(theta))), R = l / a, a = stroke/2.
 */

const DEG = Math.PI / 180;

/** V / V_c at `thetaDeg` from TDC (before or after: the mechanism is symmetric). */
export function volumeRatioAtAngle(compressionRatio: number, rodToCrankRatio: number, thetaDeg: number): number {
  const th = thetaDeg * DEG;
  const s = Math.sin(th);
  const R = Math.max(rodToCrankRatio, 1.000001);
  const root = Math.sqrt(Math.max(0, R * R - s * s));
  return 1 + 0.5 * (compressionRatio - 1) * (R + 1 - Math.cos(th) - root);
}

/** Swept volume of one cylinder, pi B^2 / 4 x stroke. */
export function sweptVolumeM3(boreM: number, strokeM: number): number {
  return (Math.PI * boreM * boreM * strokeM) / 4;
}

/** Clearance volume V_c = V_d / (r_c - 1). */
export function clearanceVolumeM3(boreM: number, strokeM: number, compressionRatio: number): number {
  return sweptVolumeM3(boreM, strokeM) / Math.max(1e-9, compressionRatio - 1);
}
