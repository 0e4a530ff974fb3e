/**
 * Words and number formats of the wiring sheet. Pure: no window, no storage, no clock, so the
 * command line's static HTML and the screen print the same text.
 */
import type { Band, ExpectedReading, PlanStatus, VerdictValue, WireStyle } from './model.js';

/** How a unit is written on the sheet. */
const unitSymbol: Record<string, string> = { V: 'V', A: 'A', ohm: 'Ω', kohm: 'kΩ', deg: '°', rpm: 'rpm', mm: 'mm' };

/** Decimals per unit: a meter's volts, amps and ohms to 2, kilohms to 1, revs to 0, gaps to 2. */
const unitDigits: Record<string, number> = { V: 2, A: 2, ohm: 2, kohm: 1, rpm: 0, mm: 2 };

export function unitText(unit: string): string {
  return unitSymbol[unit] ?? unit;
}

/** A number as the sheet prints it for `unit` (degrees: whole, or one decimal when they need it). */
export function numberFor(value: number, unit: string): string {
  if (!Number.isFinite(value)) return '—';
  let digits = unitDigits[unit];
  if (digits === undefined) {
    if (unit === 'deg') digits = Math.abs(value - Math.round(value)) < 0.05 ? 0 : 1;
    else digits = Math.abs(value) >= 100 ? 0 : Math.abs(value) >= 10 ? 1 : 2;
  }
  const text = value.toFixed(digits);
  // "-0.00" reads as a fault on a meter; print plain zero.
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}

/** "3.00 Ω", "12°", "750 rpm". Degrees sit on the number, as a strobe's scale writes them. */
export function valueText(value: number, unit: string): string {
  const n = numberFor(value, unit);
  if (unit === 'deg') return `${n}°`;
  if (unit === '') return n;
  return `${n} ${unitText(unit)}`;
}

/** "2.70–3.30 Ω": the band with its unit once. */
export function bandText(r: Pick<ExpectedReading, 'min' | 'max' | 'unit'>): string {
  const lo = numberFor(r.min, r.unit);
  const hi = numberFor(r.max, r.unit);
  if (r.unit === 'deg') return `${lo}°–${hi}°`;
  return r.unit === '' ? `${lo}–${hi}` : `${lo}–${hi} ${unitText(r.unit)}`;
}

/** A gap in mm with its inch figure beside it, for a feeler gauge marked in thou. */
export function gapText(mm: number): string {
  return `${numberFor(mm, 'mm')} mm (${(mm / 25.4).toFixed(3)} in)`;
}

/** Our own words for a reading against its band, with the band in figures. */
export function bandSentence(band: Band, value: number, r: Pick<ExpectedReading, 'min' | 'max' | 'unit'>): string {
  const v = valueText(value, r.unit);
  const b = bandText(r);
  if (band === 'low') return `Low: ${v} is below ${b}`;
  if (band === 'high') return `High: ${v} is above ${b}`;
  return `In range: ${v} is within ${b}`;
}

export const bandWords: Record<Band, string> = { in: 'In range', low: 'Low', high: 'High' };

/** Our words for the checker's verdicts (the same as the weighing screen's). */
export const verdictWords: Record<VerdictValue, string> = { pass: 'Fine', caution: 'Take care', fail: 'Not like this' };

export const statusWords: Record<PlanStatus, string> = { draft: 'Idea', checked: 'Weighed', wired: 'Wired in', done: 'Finished' };

/** What each reading measures, in plain words. */
export const quantityWords: Record<string, string> = {
  'battery-voltage-resting': 'Battery voltage at rest',
  'coil-primary-resistance': 'Coil primary resistance',
  'coil-secondary-resistance': 'Coil secondary resistance',
  'ballast-resistance': 'Ballast resistance',
  'ht-lead-resistance': 'High-tension lead resistance',
  'key-on-current': 'Coil current, key on',
  'coil-feed-voltage-key-on': 'Coil feed voltage, key on',
  'coil-switch-voltage-key-on': 'Coil switched-side voltage, key on',
  'coil-voltage-after-shut-off': 'Coil voltage after the module shuts off',
  'supply-voltage-cranking': 'Battery voltage while cranking',
  'coil-feed-voltage-cranking': 'Coil feed voltage while cranking',
  'module-supply-voltage-cranking': 'Module supply voltage while cranking',
  'supply-voltage-running': 'Battery voltage running (charging)',
  'dwell-angle': 'Dwell angle',
  'tach-idle-rpm': 'Rev counter at idle',
  'timing-idle': 'Ignition timing at idle',
  'timing-advanced': 'Ignition timing, advanced',
  'plug-gap': 'Plug gap',
  other: 'Other reading',
};

export const quantityText = (q: string): string => quantityWords[q] ?? q;

/** The wire styles in the diagram's legend: the line and its meaning, in our words. */
export const wireStyles: Record<WireStyle, { width: number; dash: string; hollow: boolean; words: string; line: string }> = {
  supply: { width: 3.4, dash: '', hollow: false, words: 'Battery feed (30), always live', line: 'thick solid line' },
  switched: { width: 2.2, dash: '', hollow: false, words: 'Switched feed (15), live with the ignition on', line: 'solid line' },
  'low-tension': { width: 2.2, dash: '9 4', hollow: false, words: 'Coil switching side (1) and module output', line: 'long dashes' },
  'high-tension': { width: 5, dash: '', hollow: true, words: 'High tension (4) to the plugs', line: 'hollow double line' },
  cranking: { width: 2.4, dash: '12 3 2 3', hollow: false, words: 'Live only while cranking (starter circuit)', line: 'dash-dot line' },
  earth: { width: 1.6, dash: '2 3', hollow: false, words: 'Earth return (31)', line: 'dotted line' },
  signal: { width: 1.3, dash: '5 3', hollow: false, words: 'Trigger or rev-counter signal', line: 'thin short dashes' },
};

export const wireStyleOrder: readonly WireStyle[] = ['supply', 'switched', 'low-tension', 'high-tension', 'cranking', 'earth', 'signal'];
