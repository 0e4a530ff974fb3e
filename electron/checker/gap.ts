/**
 * Suggested plug gap: the largest gap whose reserve still meets the margin at the worst rpm.
 * The available voltage does not depend on the gap and the required voltage only grows with it,
 * so the worst-point reserve ratio falls monotonically with the gap and bisection finds the edge.
 */
import type { RpmGrid } from './grid.js';
import { airBreakdownV, paschenBreakdownFromReducedV } from './breakdown.js';
import type { PlugGapSuggestion, PlugSpec } from './types.js';

/** Available / required at grid point i for a gap of `gapCm` (a gap that needs nothing: 1e6). */
function ratioAt(grid: RpmGrid, availableV: Float64Array, gapCm: number, paschen: boolean, polarityFactor: number, i: number): number {
  const x = gapCm * grid.densityFactor[i]!;
  const req = (paschen ? paschenBreakdownFromReducedV(x) : airBreakdownV(x)) * polarityFactor;
  return req > 0 ? availableV[i]! / req : 1e6;
}

/** Smallest available/required ratio over grid points [0, lastIndex] for a gap. */
export function worstRatioForGap(grid: RpmGrid, availableV: Float64Array, lastIndex: number, gapM: number, paschen: boolean, polarityFactor: number): number {
  const gapCm = gapM * 100;
  let worst = Infinity;
  for (let i = 0; i <= lastIndex; i++) {
    const ratio = ratioAt(grid, availableV, gapCm, paschen, polarityFactor, i);
    if (ratio < worst) worst = ratio;
  }
  return Number.isFinite(worst) ? worst : 0;
}

/**
 * Whether `worstRatioForGap(...) >= margin`, answered by stopping at the first point that falls
 * short; `firstIndex` (the rpm where the reserve was worst at the gap set) is tried first, as it
 * is the likeliest to fall short. Same answer as the full scan, in a fraction of the time.
 */
export function gapMeetsMargin(grid: RpmGrid, availableV: Float64Array, lastIndex: number, gapM: number, paschen: boolean, polarityFactor: number, margin: number, firstIndex: number): boolean {
  if (!(margin > 0)) return worstRatioForGap(grid, availableV, lastIndex, gapM, paschen, polarityFactor) >= margin;
  const gapCm = gapM * 100;
  // Any point under the margin puts the worst ratio under it (or makes it non-finite, read as 0).
  if (firstIndex >= 0 && firstIndex <= lastIndex && ratioAt(grid, availableV, gapCm, paschen, polarityFactor, firstIndex) < margin) return false;
  let worst = Infinity;
  for (let i = 0; i <= lastIndex; i++) {
    const ratio = ratioAt(grid, availableV, gapCm, paschen, polarityFactor, i);
    if (ratio < margin) return false;
    if (ratio < worst) worst = ratio;
  }
  return Number.isFinite(worst) && worst >= margin;
}

/**
 * The gap at which one point's reserve under the empirical law falls to the margin: 24.22 x +
 * 6.08 sqrt(x) = available / (1000 margin polarity) solved for sqrt(x), x the reduced gap in cm
 * (NaN where it has no positive answer). Only a first guess: the bisection's tests decide.
 */
function edgeGapM(densityFactor: number, availableV: number, margin: number, polarityFactor: number): number {
  const v = availableV / (1000 * margin * polarityFactor);
  const s = (-6.08 + Math.sqrt(6.08 * 6.08 + 4 * 24.22 * v)) / (2 * 24.22);
  return densityFactor > 0 && s > 0 ? (s * s) / densityFactor / 100 : NaN;
}

/** Search range when the plug gives none: 0.3 to 2.0 mm (common practice). */
export const DEFAULT_GAP_RANGE_M: readonly [number, number] = [0.3e-3, 2.0e-3];

/** `worstIndex`: where the reserve is worst at the gap set (a hint that only saves time). */
export function suggestGap(grid: RpmGrid, availableV: Float64Array, lastIndex: number, plug: PlugSpec | null, margin: number, paschen: boolean, polarityFactor: number, worstIndex = 0): PlugGapSuggestion {
  let lo = DEFAULT_GAP_RANGE_M[0];
  let hi = DEFAULT_GAP_RANGE_M[1];
  if (plug && plug.gapMinM > 0 && plug.gapMaxM >= plug.gapMinM) {
    lo = plug.gapMinM;
    hi = plug.gapMaxM;
  }
  const meets = (g: number): boolean => gapMeetsMargin(grid, availableV, lastIndex, g, paschen, polarityFactor, margin, worstIndex);
  const base = { searchedFromM: lo, searchedToM: hi, marginRatio: margin };
  if (!meets(lo)) return { suggestedGapM: null, ...base };
  if (meets(hi)) return { suggestedGapM: hi, ...base };
  // The empirical law gives a required voltage that never falls as the gap grows, in floating
  // point too (sums and products of non-negative terms, a correctly rounded sqrt), so every gap
  // that meets the margin lies below every gap that does not, and any pair (one that meets, one
  // that does not) rounding down to the same 0.01 mm gives the answer the halving below would.
  // Try first the pair just either side of the edge the worst rpm alone would set.
  if (!paschen && margin > 0 && polarityFactor > 0 && worstIndex >= 0 && worstIndex <= lastIndex) {
    const edge = edgeGapM(grid.densityFactor[worstIndex]!, availableV[worstIndex]!, margin, polarityFactor);
    if (edge > lo && edge < hi) {
      const a = Math.max(lo, edge * (1 - 1e-9));
      const b = Math.min(hi, edge * (1 + 1e-9));
      if (Math.floor(a * 1e5) === Math.floor(b * 1e5) && meets(a) && !meets(b)) return { suggestedGapM: Math.max(lo, Math.floor(a * 1e5) / 1e5), ...base };
    }
  }
  let a = lo;
  let b = hi;
  // The answer is rounded down to 0.01 mm: once both ends round down to the same 0.01 mm the
  // edge between them does too, so the halving stops there (what 40 halvings would print).
  for (let k = 0; k < 40 && Math.floor(a * 1e5) !== Math.floor(b * 1e5); k++) {
    const mid = 0.5 * (a + b);
    if (meets(mid)) a = mid;
    else b = mid;
  }
  // Round down to 0.01 mm so the printed value still meets the margin.
  return { suggestedGapM: Math.max(lo, Math.floor(a * 1e5) / 1e5), ...base };
}
