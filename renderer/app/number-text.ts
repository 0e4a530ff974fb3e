/**
 * A figure as a person reads it: grouped thousands and a fixed number of decimals ("1,234.5"),
 * or a dash when there is no finite value. One formatter per number of decimals is made once and
 * kept: building one per call (as `toLocaleString` with options does) cost the weighing screen
 * tens of milliseconds for each redraw of its thousands of figures.
 */
const formatters = new Map<number, Intl.NumberFormat>();

export function numberText(v: number, digits = 1): string {
  if (!Number.isFinite(v)) return '—';
  let f = formatters.get(digits);
  if (!f) {
    f = new Intl.NumberFormat('en-GB', { minimumFractionDigits: digits, maximumFractionDigits: digits });
    formatters.set(digits, f);
  }
  return f.format(v);
}
