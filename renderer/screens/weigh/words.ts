/** Plain words, units and number formats for the "weigh a combination" screen. */
import { numberText } from '../../app/number-text.js';
import { gapText, unitLabel, type GapUnit } from '../../app/units.js';

/** Our own words for the verdicts (each also has its spark-gap mark and a colour) and the plan statuses: one list, shared with the sheet. */
export { statusWords, verdictWords } from '../../sheet/format.js';

/** The two places a module can take its own supply, in plain words. */
export const feedChoices = [
  {
    value: 'switched-15',
    label: 'Straight from terminal 15 (the ignition-switch feed)',
    explain: 'The module gets the full switched supply, whatever the coil draws. This is the right way.',
  },
  {
    value: 'after-ballast',
    label: 'After the ballast (shared with the coil feed)',
    explain: 'The module sees only what is left after the ballast has dropped its share, lowest when the coil draws most and while cranking; many modules then misfire or stop.',
  },
] as const;

export const number = numberText;

export const rpmText = (v: number): string => `${number(v, 0)} rpm`;

/** Units as a restorer writes them. */
const unitShown: Record<string, string> = { ohm: 'Ω', degC: '°C', uF: 'µF', 'kV/us': 'kV/µs' };

/** A figure with its unit; gaps follow the person's mm / inch choice. */
export function figureText(value: number, unit: string, gapUnit: GapUnit): string {
  if (unit === 'mm') return `${gapText(value, gapUnit)} ${unitLabel(gapUnit)}`;
  if (unit === '') return number(value, value !== 0 && Math.abs(value) < 10 ? 2 : 1);
  const digits = Math.abs(value) >= 1000 || Number.isInteger(value) ? 0 : Math.abs(value) >= 100 ? 0 : Math.abs(value) >= 10 ? 1 : 2;
  const u = unitShown[unit] ?? unit;
  return `${number(value, digits)}${u === '%' ? '' : ' '}${u}`;
}

/** A figure's name as shown: "at rpm" beside a value in rpm reads "at", and degC is written °C. */
export function figureName(name: string, unit: string): string {
  const n = name.replace(/\bdegC\b/g, '°C').replace(/\buF\b/g, 'µF');
  return unit === 'rpm' ? n.replace(/\s*\brpm$/, '') : n;
}

export const gapWithUnit = (mm: number | null, unit: GapUnit): string => (mm === null ? '—' : `${gapText(mm, unit)} ${unitLabel(unit)}`);

export const ratioText = (r: number): string => `${number(r, 2)} ×`;
