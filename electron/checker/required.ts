/**
 * Voltage the plug needs at the moment of the spark, across rpm: spark angle from the static
 * timing plus the mechanical advance curve, cylinder state from the slider-crank and polytropic
 * compression, then the breakdown law on the density-reduced gap.
 */
import { airBreakdownV, paschenBreakdownFromReducedV, reducedGapCm } from './breakdown.js';
import { compressInto, POLYTROPIC_INDEX, type CompressedState } from './compression.js';
import { volumeRatioAtAngle } from './geometry.js';
import type { AdvanceRow, BreakdownModel } from './types.js';

/** Static timing plus the advance curve interpolated at rpm (held flat beyond its ends). */
export function sparkAngleDegBtdc(staticDeg: number, curve: readonly AdvanceRow[], rpm: number): number {
  const n = curve.length;
  if (n === 0) return staticDeg;
  if (rpm <= curve[0]!.rpm) return staticDeg + curve[0]!.advanceDeg;
  if (rpm >= curve[n - 1]!.rpm) return staticDeg + curve[n - 1]!.advanceDeg;
  let i = 1;
  while (curve[i]!.rpm < rpm) i++;
  const a = curve[i - 1]!;
  const b = curve[i]!;
  const span = b.rpm - a.rpm;
  const adv = span > 0 ? a.advanceDeg + ((b.advanceDeg - a.advanceDeg) * (rpm - a.rpm)) / span : b.advanceDeg;
  return staticDeg + adv;
}

/**
 * Cylinder state at a spark angle. The charge is taken as closed at BDC (V1 = r_c V_c), and the
 * angle is clamped to 0..170 degrees from TDC (the model does not apply past BDC).
 */
export function cylinderStateInto(out: CompressedState, compressionRatio: number, rodToCrankRatio: number, angleDegBtdc: number, p1Pa: number, t1K: number, polytropicIndex = POLYTROPIC_INDEX): CompressedState {
  const theta = Math.min(170, Math.abs(angleDegBtdc));
  const vOverVc = volumeRatioAtAngle(compressionRatio, rodToCrankRatio, theta);
  return compressInto(out, p1Pa, t1K, compressionRatio / vOverVc, polytropicIndex);
}

/** Breakdown voltage of a gap in a given cylinder state, by the chosen law. */
export function breakdownV(model: BreakdownModel, gapM: number, pressurePa: number, temperatureK: number): number {
  const x = reducedGapCm(gapM, pressurePa, temperatureK);
  return model === 'paschen' ? paschenBreakdownFromReducedV(x) : airBreakdownV(x);
}
