/**
 * Version 2: the wiring sheet's ticks, and every stored reading in its quantity's one unit.
 *
 * - sheet_ticks: one row per ticked step of a plan's wiring sheet (step keys are the sheet's own,
 *   "measure.coil-primary"), removed with the plan. `ticked_on` is when it was ticked (ISO 8601).
 * - readings: version 1 stored a reading's value with whatever unit was typed, and the checker
 *   read the value as if it were in the quantity's unit, so a coil read as 1400 mohm counted as
 *   1400 ohm. From version 2 each quantity has one unit (`readingUnits` in db/schema.ts) and the
 *   repository converts on the way in. This migration converts the rows already stored, with the
 *   same table of accepted units the repository uses (milli is a lower-case m, mega an upper-case
 *   M; "MOHM" could be either, so it is not guessed at; inch = 25.4 mm, thou = 0.001 inch).
 *   A reading whose unit cannot be converted is NOT deleted and NOT guessed at: it moves to the
 *   quantity 'other' (which keeps any unit and is never used by the checker), with its value and
 *   unit as they were and its note prefixed with what it was recorded as. Nothing is lost, and
 *   nothing is misread.
 *
 * The unit table is written out here rather than imported, so this migration keeps doing exactly
 * what it did when it shipped even if the store's table grows later.
 */
import type { Migration } from './types.js';

/** Each quantity's stored unit, as of version 2. */
const UNIT_OF: Readonly<Record<string, string>> = {
  'battery-voltage-resting': 'V',
  'coil-primary-resistance': 'ohm',
  'coil-secondary-resistance': 'kohm',
  'ballast-resistance': 'ohm',
  'ht-lead-resistance': 'kohm',
  'key-on-current': 'A',
  'coil-feed-voltage-key-on': 'V',
  'coil-switch-voltage-key-on': 'V',
  'coil-voltage-after-shut-off': 'V',
  'supply-voltage-cranking': 'V',
  'coil-feed-voltage-cranking': 'V',
  'module-supply-voltage-cranking': 'V',
  'supply-voltage-running': 'V',
  'dwell-angle': 'deg',
  'tach-idle-rpm': 'rpm',
  'timing-idle': 'deg',
  'timing-advanced': 'deg',
  'plug-gap': 'mm',
};

const quantitiesIn = (unit: string): string =>
  Object.entries(UNIT_OF)
    .filter(([, u]) => u === unit)
    .map(([q]) => `'${q}'`)
    .join(', ');

// SQLite compares text case-sensitively (BINARY) and its lower()/upper() fold A-Z only, as the
// repository's own check does.
const OHM_WORD = (x: string): string => `(lower(${x}) IN ('ohm', 'ohms') OR ${x} IN ('Ω', 'Ω'))`;
const FIRST = 'substr(unit, 1, 1)';
const REST = 'substr(unit, 2)';
const PLAIN_OHM = OHM_WORD('unit');
const MILLI_OHM = `(${FIRST} = 'm' AND ${OHM_WORD(REST)})`;
const KILO_OHM = `(${FIRST} IN ('k', 'K') AND ${OHM_WORD(REST)})`;
// "Mohm", "MOhm", "MΩ" are mega; "MOHM" (all capitals) could be a milli typed with caps lock.
const MEGA_OHM = `(${FIRST} = 'M' AND (${REST} IN ('Ω', 'Ω') OR (lower(${REST}) IN ('ohm', 'ohms') AND ${REST} <> upper(${REST}))))`;
const VOLT_WORD = (x: string): string => `lower(${x}) IN ('v', 'volt', 'volts')`;
const AMP_WORD = (x: string): string => `lower(${x}) IN ('a', 'amp', 'amps', 'ampere', 'amperes')`;

const convert = (unit: string, where: string, scale: string): string =>
  `UPDATE readings SET value = value${scale}, unit = '${unit}' WHERE quantity IN (${quantitiesIn(unit)}) AND unit <> '${unit}' AND ${where};`;

const canonicalCase = `CASE quantity ${Object.entries(UNIT_OF)
  .map(([q, u]) => `WHEN '${q}' THEN '${u}'`)
  .join(' ')} END`;

export const migration002: Migration = {
  version: 2,
  name: 'sheet ticks and one unit per reading quantity',
  sql: `
CREATE TABLE sheet_ticks (
  plan_id   INTEGER NOT NULL REFERENCES plans (id) ON DELETE CASCADE,
  step_key  TEXT NOT NULL,
  ticked_on TEXT NOT NULL,
  PRIMARY KEY (plan_id, step_key)
) STRICT;

-- Resistances kept in ohm: milliohm / 1000, kilohm x 1000, megohm x 1 000 000, other spellings of ohm as they are.
${convert('ohm', MILLI_OHM, ' * 1 / 1000.0')}
${convert('ohm', KILO_OHM, ' * 1000')}
${convert('ohm', MEGA_OHM, ' * 1000000')}
${convert('ohm', PLAIN_OHM, '')}
-- Resistances kept in kohm: milliohm / 1 000 000, ohm / 1000, megohm x 1000, other spellings of kohm as they are.
${convert('kohm', MILLI_OHM, ' * 1 / 1000000.0')}
${convert('kohm', PLAIN_OHM, ' * 1 / 1000.0')}
${convert('kohm', MEGA_OHM, ' * 1000')}
${convert('kohm', KILO_OHM, '')}
-- Voltages in V and currents in A: milli / 1000, other spellings as they are.
${convert('V', `(${FIRST} = 'm' AND ${VOLT_WORD(REST)})`, ' * 1 / 1000.0')}
${convert('V', VOLT_WORD('unit'), '')}
${convert('A', `(${FIRST} = 'm' AND ${AMP_WORD(REST)})`, ' * 1 / 1000.0')}
${convert('A', AMP_WORD('unit'), '')}
-- Plug gaps in mm: inch x 25.4, thou x 0.0254.
${convert('mm', `lower(unit) IN ('in', 'inch', 'inches')`, ' * 254 / 10.0')}
${convert('mm', `lower(unit) = 'thou'`, ' * 254 / 10000.0')}
-- Angles in deg, speeds in rpm: other spellings as they are.
${convert('deg', `(lower(unit) IN ('deg', 'degree', 'degrees') OR unit = '°')`, '')}
${convert('rpm', `lower(unit) IN ('rpm', 'r/min')`, '')}

-- Whatever is still not in its quantity's unit moves to 'other', value and unit untouched, its note
-- saying what it was recorded as (SET reads the row as it was before this UPDATE).
UPDATE readings
   SET note = '(Recorded as ' || quantity || ' in "' || unit || '", which could not be converted to ' || ${canonicalCase} || '.) ' || note,
       quantity = 'other'
 WHERE quantity <> 'other' AND ${canonicalCase} IS NOT NULL AND unit <> ${canonicalCase};
`,
};
