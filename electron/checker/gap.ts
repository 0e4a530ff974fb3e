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
 * short. The scan starts at `firstIndex` (the rpm where the reserve was worst at the gap set, the
 * likeliest to fall short), runs to `lastIndex`, then wraps round to the points before it, so each
 * point is read once. Same answer as the full scan, in a fraction of the time.
 */
export function gapMeetsMargin(grid: RpmGrid, availableV: Float64Array, lastIndex: number, gapM: number, paschen: boolean, polarityFactor: number, margin: number, firstIndex: number): boolean {
  if (!(margin > 0)) return worstRatioForGap(grid, availableV, lastIndex, gapM, paschen, polarityFactor) >= margin;
  const gapCm = gapM * 100;
  const start = firstIndex > 0 && firstIndex <= lastIndex ? firstIndex : 0;
  // A worst ratio that is not finite reads as 0, under any positive margin: at least one finite
  // ratio is needed (NaN ratios are skipped, as the full scan's `<` skips them).
  let finite = false;
  for (let k = 0; k <= lastIndex; k++) {
    const i = start + k <= lastIndex ? start + k : start + k - lastIndex - 1;
    const ratio = ratioAt(grid, availableV, gapCm, paschen, polarityFactor, i);
    if (ratio < margin) return false;
    if (ratio < Infinity) finite = true;
  }
  return finite;
}

/**
 * The gap at which one point's reserve under the empirical law falls to the margin: 24.22 x +
 * 6.08 sqrt(x) = available / (1000 margin polarity) solved for sqrt(x), x the reduced gap in cm
 * (NaN where it has no positive answer). The search below uses it as a first guess only.
 */
export function airLawEdgeGapM(densityFactor: number, availableV: number, margin: number, polarityFactor: number): number {
  const v = availableV / (1000 * margin * polarityFactor);
  const s = (-6.08 + Math.sqrt(6.08 * 6.08 + 4 * 24.22 * v)) / (2 * 24.22);
  return densityFactor > 0 && s > 0 ? (s * s) / densityFactor / 100 : NaN;
}

/** Search range when the plug gives none: 0.3 to 2.0 mm (common practice). */
export const DEFAULT_GAP_RANGE_M: readonly [number, number] = [0.3e-3, 2.0e-3];

/** Suggested gaps are whole hundredths of a millimetre (steps of 1e-5 m), rounded down. */
const STEPS_PER_M = 1e5;

/**
 * The largest whole 0.01 mm step in [lo, hi) at which `meets` holds, or `lo` itself when none
 * does; the caller has checked that `lo` meets and `hi` does not, and `meets` must hold below
 * some gap and fail above it. A bisection over whole steps; `guessM` (any number) is tried first,
 * with the step above it, and each answer narrows the range whatever it is, so an exact guess
 * decides in two calls and a wrong one costs at most two.
 */
export function largestMeetingGapM(lo: number, hi: number, meets: (gapM: number) => boolean, guessM: number): number {
  const first = Math.ceil(lo * STEPS_PER_M);
  let good = first - 1; // known to meet (or the step below lo, which stands for lo itself)
  let bad = Math.ceil(hi * STEPS_PER_M); // known to fail: at or above hi
  const g = Math.floor(guessM * STEPS_PER_M);
  if (g > good && g < bad) {
    if (!meets(g / STEPS_PER_M)) bad = g;
    else {
      good = g;
      if (g + 1 < bad && !meets((g + 1) / STEPS_PER_M)) bad = g + 1;
    }
  }
  while (bad - good > 1) {
    const mid = Math.floor((good + bad) / 2);
    if (meets(mid / STEPS_PER_M)) good = mid;
    else bad = mid;
  }
  return good < first ? lo : good / STEPS_PER_M;
}

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
  // First guess: the edge the worst rpm alone sets under the empirical law (under Paschen's law,
  // which reads higher, it lands just above the answer and still halves the range).
  const guess = airLawEdgeGapM(grid.densityFactor[worstIndex]!, availableV[worstIndex]!, margin, polarityFactor);
  return { suggestedGapM: largestMeetingGapM(lo, hi, meets, guess), ...base };
}
