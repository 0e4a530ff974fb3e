/**
 * Axis and scale arithmetic for the charts, kept pure so it can be tested without a browser.
 * Tick steps follow the "nice numbers" method (P. S. Heckbert, "Nice Numbers for Graph Labels",
 * Graphics Gems, 1990): a step of 1, 2 or 5 times a power of ten, and axis ends on whole steps.
 */

export type Scale = { map(v: number): number; invert(px: number): number };

/** Maps the data interval [d0, d1] onto pixels [r0, r1]; a zero-width interval maps to the middle. */
export function linearScale(d0: number, d1: number, r0: number, r1: number): Scale {
  const span = d1 - d0;
  if (!Number.isFinite(span) || span === 0) {
    const mid = (r0 + r1) / 2;
    return { map: () => mid, invert: () => d0 };
  }
  const k = (r1 - r0) / span;
  return { map: (v) => r0 + (v - d0) * k, invert: (px) => d0 + (px - r0) / k };
}

/** Heckbert's nice number: the 1, 2, 5 (or 10) multiple of a power of ten nearest `x` (round) or above it. */
export function niceNumber(x: number, round: boolean): number {
  if (!(x > 0) || !Number.isFinite(x)) return 1;
  const exp = Math.floor(Math.log10(x));
  const f = x / 10 ** exp;
  let nf: number;
  if (round) nf = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
  else nf = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
  return nf * 10 ** exp;
}

export type Ticks = { min: number; max: number; step: number; values: number[] };

/**
 * About `count` ticks covering [lo, hi], with the axis widened to whole steps. Heckbert first
 * rounds the range itself up to a nice number; we take the step straight from the data range,
 * which gives finer steps on short axes (0 to 101 in 20s rather than 50s).
 */
export function niceTicks(lo: number, hi: number, count = 5): Ticks {
  let a = Number.isFinite(lo) ? lo : 0;
  let b = Number.isFinite(hi) ? hi : 1;
  if (a > b) [a, b] = [b, a];
  if (a === b) {
    const pad = a === 0 ? 1 : Math.abs(a) * 0.1;
    a -= pad;
    b += pad;
  }
  const step = niceNumber((b - a) / Math.max(1, count - 1), true);
  let min = Math.floor(a / step) * step;
  let max = Math.ceil(b / step) * step;
  // a / step can underflow to zero for a tiny a; step out once more so the axis still covers it.
  if (min > a) min -= step;
  if (max < b) max += step;
  const values: number[] = [];
  // Count steps rather than add them, so float error never adds or drops a tick.
  const n = Math.round((max - min) / step);
  for (let i = 0; i <= n; i++) values.push(Number((min + i * step).toPrecision(12)));
  return { min, max, step, values };
}

/** Decimals a tick label needs for this step (0.5 -> 1, 20 -> 0). */
export function tickDecimals(step: number): number {
  if (!(step > 0) || !Number.isFinite(step)) return 0;
  return Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
}

/** An SVG path through the points from index `from` on; non-finite points break the line. */
export function linePath(xs: readonly number[], ys: readonly number[], sx: Scale, sy: Scale, from = 0): string {
  let d = '';
  let pen = false;
  for (let i = from; i < Math.min(xs.length, ys.length); i++) {
    const x = xs[i]!;
    const y = ys[i]!;
    if (!Number.isFinite(x) || !Number.isFinite(y)) {
      pen = false;
      continue;
    }
    d += `${pen ? 'L' : 'M'}${sx.map(x).toFixed(1)} ${sy.map(y).toFixed(1)}`;
    pen = true;
  }
  return d;
}

/** A closed area between `lower` and `upper` over the same x, from index `from` on. */
export function bandPath(xs: readonly number[], lower: readonly number[], upper: readonly number[], sx: Scale, sy: Scale, from = 0): string {
  const n = Math.min(xs.length, lower.length, upper.length);
  if (n - from < 2) return '';
  let d = '';
  for (let i = from; i < n; i++) d += `${i === from ? 'M' : 'L'}${sx.map(xs[i]!).toFixed(1)} ${sy.map(upper[i]!).toFixed(1)}`;
  for (let i = n - 1; i >= from; i--) d += `L${sx.map(xs[i]!).toFixed(1)} ${sy.map(lower[i]!).toFixed(1)}`;
  return `${d}Z`;
}

/** Index of the value in a rising array nearest to `x` (binary search); -1 for an empty array. */
export function nearestIndex(sorted: readonly number[], x: number): number {
  const n = sorted.length;
  if (n === 0) return -1;
  if (!(x > sorted[0]!)) return 0;
  if (!(x < sorted[n - 1]!)) return n - 1;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid]! <= x) lo = mid;
    else hi = mid;
  }
  return x - sorted[lo]! <= sorted[hi]! - x ? lo : hi;
}

/** The largest finite value across several columns (0 when there is none). */
export function maxOf(columns: ReadonlyArray<readonly number[]>): number {
  let m = 0;
  let seen = false;
  for (const col of columns) {
    for (const v of col) {
      if (Number.isFinite(v) && (!seen || v > m)) {
        m = v;
        seen = true;
      }
    }
  }
  return seen ? m : 0;
}

/** Indices for sparse markers along a line: about `count` of them, evenly spaced, from `from`. */
export function markerIndices(length: number, count: number, from = 0, offset = 0): number[] {
  const n = length - from;
  if (n <= 0 || count <= 0) return [];
  const step = Math.max(1, Math.floor(n / count));
  const out: number[] = [];
  for (let i = from + (offset % step); i < length; i += step) out.push(i);
  return out;
}
