/**
 * Compression of the charge from inlet closing (taken at BDC) to the spark: polytropic,
 * p = p1 (V1/V)^n, T = T1 (V1/V)^(n-1), n = 1.3 (Heywood 1988, from memory). At full load
 * p1 = volumetric efficiency x ambient pressure: the densest charge is the hardest to break down.
 * The index is a working condition (`polytropicIndex`, default 1.3); this constant is its default.
 * The charge at inlet closing is warm (the inlet charge temperature) on a running engine and at
 * ambient on the cranking point (grid.ts): gas density (p1/T1)(V1/V) sets the breakdown.
 */

export const POLYTROPIC_INDEX = 1.3;

export interface CompressedState {
  pressurePa: number;
  temperatureK: number;
}

/** State at volume ratio `v1OverV` = V_BDC / V. Writes into `out` so the sweep allocates nothing. */
export function compressInto(out: CompressedState, p1Pa: number, t1K: number, v1OverV: number, n = POLYTROPIC_INDEX): CompressedState {
  const r = Math.max(1e-6, v1OverV);
  const lnr = Math.log(r);
  out.pressurePa = p1Pa * Math.exp(n * lnr);
  out.temperatureK = t1K * Math.exp((n - 1) * lnr);
  return out;
}
