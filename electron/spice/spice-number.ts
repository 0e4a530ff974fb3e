/**
 * Numbers written the way a SPICE reader expects them: engineering suffixes (8m, 250n, 80p,
 * 100Meg) so a deck reads like a schematic. Beware SPICE's own trap: `M` means milli, so
 * mega is always written `Meg`.
 */
const suffixes: ReadonlyArray<readonly [number, string]> = [
  [1e12, 'T'],
  [1e9, 'G'],
  [1e6, 'Meg'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'u'],
  [1e-9, 'n'],
  [1e-12, 'p'],
  [1e-15, 'f'],
];

/** Format a finite number with up to `digits` significant digits and an engineering suffix. */
export function spiceNumber(value: number, digits = 7): string {
  if (!Number.isFinite(value)) throw new RangeError(`Cannot write ${value} into a SPICE deck.`);
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  const pick = suffixes.find(([scale]) => magnitude >= scale * 0.9999999) ?? suffixes[suffixes.length - 1]!;
  const [scale, suffix] = pick;
  const mantissa = Number((value / scale).toPrecision(digits));
  return `${String(mantissa)}${suffix}`;
}

const prefixes: ReadonlyArray<readonly [number, string]> = [
  [1e9, 'G'],
  [1e6, 'M'],
  [1e3, 'k'],
  [1, ''],
  [1e-3, 'm'],
  [1e-6, 'u'],
  [1e-9, 'n'],
  [1e-12, 'p'],
];

/** A value with an SI prefix and its unit, for the comments a person reads: "8 mH", "250 nF". */
export function withUnit(value: number, unit: string, digits = 5): string {
  if (!Number.isFinite(value)) return `${value} ${unit}`;
  if (value === 0) return `0 ${unit}`;
  const magnitude = Math.abs(value);
  const [scale, prefix] = prefixes.find(([s]) => magnitude >= s * 0.9999999) ?? prefixes[prefixes.length - 1]!;
  return `${String(Number((value / scale).toPrecision(digits)))} ${prefix}${unit}`;
}
