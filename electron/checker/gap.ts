/**
 * Suggested plug gap: the largest gap whose reserve still meets the margin at the worst rpm.
 * The available voltage does not depend on the gap and the required voltage only grows with it,
 * so the worst-point reserve ratio falls monotonically with the gap and bisection finds the edge.
 */
import type { RpmGrid } from './grid.js';
import { airBreakdownV, paschenBreakdownFromReducedV } from './breakdown.js';
import type { PlugGapSuggestion, PlugSpec } from './types.js';

/** Smallest available/required ratio over grid points [0, lastIndex] for a gap. */
export function worstRatioForGap(grid: RpmGrid, availableV: Float64Array, lastIndex: number, gapM: number, paschen: boolean, polarityFactor: number): number {
  const gapCm = gapM * 100;
  let worst = Infinity;
  for (let i = 0; i <= lastIndex; i++) {
    const x = gapCm * grid.densityFactor[i]!;
    const req = (paschen ? paschenBreakdownFromReducedV(x) : airBreakdownV(x)) * polarityFactor;
    const ratio = req > 0 ? availableV[i]! / req : 1e6;
    if (ratio < worst) worst = ratio;
  }
  return Number.isFinite(worst) ? worst : 0;
}

/** Search range when the plug gives none: 0.3 to 2.0 mm (common practice). */
export const DEFAULT_GAP_RANGE_M: readonly [number, number] = [0.3e-3, 2.0e-3];

export function suggestGap(grid: RpmGrid, availableV: Float64Array, lastIndex: number, plug: PlugSpec | null, margin: number, paschen: boolean, polarityFactor: number): PlugGapSuggestion {
  let lo = DEFAULT_GAP_RANGE_M[0];
  let hi = DEFAULT_GAP_RANGE_M[1];
  if (plug && plug.gapMinM > 0 && plug.gapMaxM >= plug.gapMinM) {
    lo = plug.gapMinM;
    hi = plug.gapMaxM;
  }
  const meets = (g: number): boolean => worstRatioForGap(grid, availableV, lastIndex, g, paschen, polarityFactor) >= margin;
  const base = { searchedFromM: lo, searchedToM: hi, marginRatio: margin };
  if (!meets(lo)) return { suggestedGapM: null, ...base };
  if (meets(hi)) return { suggestedGapM: hi, ...base };
  let a = lo;
  let b = hi;
  for (let k = 0; k < 40; k++) {
    const mid = 0.5 * (a + b);
    if (meets(mid)) a = mid;
    else b = mid;
  }
  // Round down to 0.01 mm so the printed value still meets the margin.
  return { suggestedGapM: Math.max(lo, Math.floor(a * 1e5) / 1e5), ...base };
}
