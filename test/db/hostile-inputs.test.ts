/**
 * Issue 8, defect 6: inputs that passed but should not. Each is refused at the store boundary with
 * a sentence on the field concerned, and nothing is written. Characters by their Unicode names
 * (unicode.org/charts): U+200B ZERO WIDTH SPACE, U+3164 HANGUL FILLER, U+00AD SOFT HYPHEN, U+202E
 * RIGHT-TO-LEFT OVERRIDE, U+2066 LEFT-TO-RIGHT ISOLATE, U+0007 BELL, U+D800 a high surrogate alone.
 */
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { StoreError } from '../../db/errors.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories, type Repositories } from '../../db/repositories/index.js';
import { coilIn, engineIn, planIn, readingIn, tempDir } from './samples.js';
import type Database from 'better-sqlite3';

function refusal(fn: () => unknown): Record<string, string> {
  try {
    fn();
  } catch (err) {
    if (err instanceof StoreError && err.code === 'INVALID_INPUT') return err.fields ?? {};
    throw err;
  }
  throw new Error('expected INVALID_INPUT, but the write succeeded');
}

let db: Database.Database;
let repos: Repositories;
let cleanup: () => void;
beforeEach(() => {
  const t = tempDir('hostile');
  cleanup = t.cleanup;
  db = openStore(join(t.dir, 'workshop.sqlite3'));
  repos = createRepositories(db);
});
afterEach(() => {
  closeStore(db);
  cleanup();
});
const count = (table: string): number => (db.prepare(`SELECT COUNT(*) AS n FROM ${table}`).get() as { n: number }).n;

const names: Array<[string, string, RegExp]> = [
  ['only zero-width spaces', '\u200B\u200B', /no letters, digits or signs you can see/],
  ['only Hangul fillers', '\u3164\u3164', /no letters, digits or signs you can see/],
  ['only a soft hyphen and a space', '\u00AD \u00AD', /no letters, digits or signs you can see/],
  ['a right-to-left override', 'Coil \u202Eevil', /hidden text-direction characters/],
  ['a left-to-right isolate', 'Coil \u2066x\u2069', /hidden text-direction characters/],
  ['a bell character', 'Coil\u0007', /control characters/],
  ['a line break', 'Coil\nsecond line', /control characters or line breaks/],
  ['a lone high surrogate', 'Coil \uD800', /broken character/],
  ['a lone low surrogate', '\uDC00 Coil', /broken character/],
];

describe('names and text', () => {
  it.each(names)('refuses a part name with %s, on name, and stores nothing', (_what, name, message) => {
    expect(refusal(() => repos.parts.create({ ...coilIn, name }))['name']).toMatch(message);
    expect(count('parts')).toBe(0);
  });

  it.each(names)('refuses an engine name with %s, on name', (_what, name, message) => {
    expect(refusal(() => repos.engines.create({ ...engineIn(), name }))['name']).toMatch(message);
    expect(count('engines')).toBe(0);
  });

  it.each(names)('refuses a plan name with %s, on name', (_what, name, message) => {
    const e = repos.engines.create(engineIn());
    expect(refusal(() => repos.plans.create({ ...planIn(e.id), name }))['name']).toMatch(message);
    expect(count('plans')).toBe(0);
  });

  it('keeps ordinary names in any script, and notes with line breaks and tabs', () => {
    for (const name of ['Bobina 1,5 Ω', 'Катушка', 'コイル', 'Coil – 6 V “special”', 'Coil \u{1F527}']) {
      expect(repos.parts.create({ ...coilIn, name, notes: 'first line\n\tsecond line' }).name).toBe(name);
    }
  });

  it('refuses a bidi override or a control character in notes and in a reading note, on that field', () => {
    expect(refusal(() => repos.parts.create({ ...coilIn, notes: 'ok \u202E' }))['notes']).toMatch(/hidden text-direction/);
    expect(refusal(() => repos.parts.create({ ...coilIn, notes: 'ok \u0000' }))['notes']).toMatch(/control characters/);
    const e = repos.engines.create(engineIn());
    const p = repos.plans.create(planIn(e.id));
    expect(refusal(() => repos.readings.add({ ...readingIn(p.id), note: '\uD83D' }))['note']).toMatch(/broken character/);
  });

  it('a row stored before these rules with such a name still reads (the rules check input only)', () => {
    const coil = repos.parts.create(coilIn);
    db.prepare('UPDATE parts SET name = ? WHERE id = ?').run('\u200B', coil.id);
    expect(repos.parts.get(coil.id).name).toBe('\u200B');
  });
});

describe('numbers without a plausible range', () => {
  it('refuses an advance-curve rpm of 1e21 on that row, and stores nothing', () => {
    const fields = refusal(() => repos.engines.create({ ...engineIn(), advanceCurve: [{ rpm: 800, advanceDeg: 0 }, { rpm: 1e21, advanceDeg: 20 }] }));
    expect(fields['advanceCurve.1.rpm']).toBe('An advance-curve rpm above 20000 is not plausible.');
    expect(count('engines') + count('advance_points')).toBe(0);
  });

  // Each limit from the quantity's range in db/schema.ts (readingRanges); the values are far outside
  // what a workshop meter shows on a 6 or 12 V car (common practice).
  const readings: Array<[string, number, string, string]> = [
    ['battery-voltage-resting', 1e21, 'V', 'between -100 and 100 V'],
    ['key-on-current', -400, 'A', 'between -50 and 50 A'],
    ['coil-primary-resistance', -3, 'ohm', 'between 0 and 100000 ohm'],
    ['ht-lead-resistance', 5e6, 'kohm', 'between 0 and 1000 kohm'],
    ['dwell-angle', 720, 'deg', 'between 0 and 360 deg'],
    ['tach-idle-rpm', 1e9, 'rpm', 'between 0 and 20000 rpm'],
    ['plug-gap', 40, 'mm', 'between 0 and 5 mm'],
    ['other', 1e300, 'V', 'between -1000000000 and 1000000000'],
  ];
  it.each(readings)('refuses a %s reading of %d %s on value', (quantity, value, unit, words) => {
    const e = repos.engines.create(engineIn());
    const p = repos.plans.create(planIn(e.id));
    const fields = refusal(() => repos.readings.add({ planId: p.id, quantity: quantity as never, value, unit, takenOn: '2024-03-09', note: '' }));
    expect(fields['value']).toContain(words);
    expect(count('readings')).toBe(0);
  });

  it('converts before it judges: 12600 mV is 12.6 V and passes, 250 000 mV is 250 V and does not', () => {
    const e = repos.engines.create(engineIn());
    const p = repos.plans.create(planIn(e.id));
    const base = { planId: p.id, quantity: 'battery-voltage-resting' as const, takenOn: '2024-03-09', note: '' };
    expect(repos.readings.add({ ...base, value: 12600, unit: 'mV' }).value).toBeCloseTo(12.6, 12);
    expect(refusal(() => repos.readings.add({ ...base, value: 250000, unit: 'mV' }))['value']).toContain('between -100 and 100 V');
  });
});

describe('dates', () => {
  it.each(['2024-99-99', '2023-02-29', '2024-13-01', '2024-04-31', '0000-00-00'])('refuses the reading date %s on takenOn', (takenOn) => {
    const e = repos.engines.create(engineIn());
    const p = repos.plans.create(planIn(e.id));
    expect(refusal(() => repos.readings.add({ ...readingIn(p.id), takenOn }))['takenOn']).toMatch(/not a day on the calendar/);
  });
  it('takes 29 February in a leap year (2024: divisible by 4, not by 100)', () => {
    const e = repos.engines.create(engineIn());
    const p = repos.plans.create(planIn(e.id));
    expect(repos.readings.add({ ...readingIn(p.id), takenOn: '2024-02-29' }).takenOn).toBe('2024-02-29');
  });
});
