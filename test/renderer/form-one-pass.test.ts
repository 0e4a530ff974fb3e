/**
 * Every check in one pass (renderer/app/one-pass.ts through the engine and part form models), and
 * the list of things to fix naming each field with its unit (renderer/app/problem-lines.ts).
 *
 * The limits checked are trade facts (common practice): an engine idles above cranking speed and
 * below its redline; a connecting rod is longer than half the stroke (slider-crank geometry: the
 * crank radius is half the stroke and the rod must clear it, Heywood 1988, ch. 2); an advance
 * curve rises with rpm; a module's highest supply is above its lowest. No expected message is
 * taken from the code under test: each is written out here.
 */
import { describe, expect, it } from 'vitest';
import type { Engine, Part } from '../../db/schema.js';
import { problemLine, unitOfLabel } from '../../renderer/app/problem-lines.js';
import { engineToForm, formToInput, type EngineForm } from '../../renderer/screens/engines/form-model.js';
import { formToInput as partFormToInput, partToForm } from '../../renderer/screens/parts/form-model.js';
import { engineIn, moduleIn, plugIn } from '../db/samples.js';

const form = (): EngineForm => engineToForm({ ...engineIn(), id: 7, updatedAt: '2026-01-01T00:00:00.000Z' } as Engine, 'mm');
const errorsOf = (f: EngineForm): Record<string, string> => {
  const r = formToInput(f);
  expect(r.ok).toBe(false);
  return r.ok ? {} : r.errors;
};

describe('the engine form checks everything in one pass', () => {
  it('says "redline below idle" together with a letter typed in another number', () => {
    // Idle 800 rpm, redline typed as 500 rpm: a redline below idle cannot be (common practice).
    const e = errorsOf({ ...form(), redlineRpm: '500', boreMm: '8o' });
    expect(e.redlineRpm).toBe('Redline must be above idle speed.');
    expect(e.boreMm).toBe('Bore must be a number, for example 12 or 0.4.');
    expect(Object.keys(e).sort()).toEqual(['boreMm', 'redlineRpm']);
  });

  it('also gives a rod shorter than half the stroke beside a letter in the compression ratio', () => {
    // Stroke 80 mm: the crank radius is 40 mm, so a 30 mm rod cannot reach (slider-crank geometry).
    const e = errorsOf({ ...form(), conRodMm: '30', compressionRatio: 'eight' });
    expect(e.conRodMm).toBe('The connecting rod must be longer than half the stroke.');
    expect(e.compressionRatio).toBe('Compression ratio must be a number, for example 12 or 0.4.');
  });

  it('does not judge a comparison whose other side is still unreadable', () => {
    // Idle unreadable: neither "cranking below idle" nor "redline above idle" can be judged yet.
    const e = errorsOf({ ...form(), idleRpm: 'idle' });
    expect(Object.keys(e)).toEqual(['idleRpm']);
    // Cylinders unreadable: the dwell limit (360 / cylinders) and the firing order wait for it.
    const c = errorsOf({ ...form(), cylinders: 'four', pointsDwellDeg: '80' });
    expect(Object.keys(c)).toEqual(['cylinders']);
  });

  it('keeps reporting every readable problem when two boxes hold letters', () => {
    const e = errorsOf({ ...form(), boreMm: 'x', strokeMm: 'y', crankingRpm: '900' });
    // Cranking 900 rpm is not below idle 800 rpm: judged, since both are readable.
    expect(e.crankingRpm).toBe('Cranking speed must be below idle speed.');
    expect(e.boreMm).toMatch(/^Bore must be a number/);
    expect(e.strokeMm).toMatch(/^Stroke must be a number/);
  });
});

describe('the advance curve in the engine form', () => {
  it('leaves a newly added blank row out, with no message', () => {
    const f = form();
    const withBlank = { ...f, advanceCurve: [...f.advanceCurve, { key: 999, rpm: '', advanceDeg: '' }] };
    const r = formToInput(withBlank);
    expect(r.ok).toBe(true);
    if (r.ok) expect(r.input.advanceCurve).toHaveLength(4); // the sample's four rows, the blank one left out
  });

  it('names rows by their place in the form even with a blank row above', () => {
    const f = form();
    const rows = [
      { key: 1, rpm: '1000', advanceDeg: '5' },
      { key: 2, rpm: '', advanceDeg: '' },
      { key: 3, rpm: '900', advanceDeg: '8' },
    ];
    // 900 rpm after 1000 rpm: a curve must rise with rpm; the third row of the form is named.
    const e = errorsOf({ ...f, advanceCurve: rows });
    expect(e).toEqual({ 'advanceCurve.2.rpm': 'Each row needs a higher rpm than the row above.' });
  });

  it('asks for the missing half of a row typed in', () => {
    const f = form();
    const e = errorsOf({ ...f, advanceCurve: [{ key: 1, rpm: '1500', advanceDeg: '' }] });
    expect(e['advanceCurve.0.advanceDeg']).toBeDefined();
    expect(e['advanceCurve.0.rpm']).toBeUndefined();
  });
});

describe('the part form checks everything in one pass', () => {
  it('says "highest supply below lowest" together with a letter in the maximum current', () => {
    const f = partToForm({ ...moduleIn, id: 3, updatedAt: 'x' } as Part, 'mm');
    const typed = { ...f, module: { ...f.module, supplyMinV: '14', supplyMaxV: '8', maxCurrentA: '8 A' } };
    const r = partFormToInput(typed, 'mm');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.supplyMaxV).toBe('The maximum supply must be above the minimum.');
    expect(r.errors.maxCurrentA).toBe('Maximum current must be a number, for example 12 or 0.4.');
  });

  it('says a plug gap range is upside down beside a letter in the resistor value', () => {
    const f = partToForm({ ...plugIn, id: 4, updatedAt: 'x' } as Part, 'mm');
    const typed = { ...f, plug: { ...f.plug, resistorOhm: '5k', gapMin: { text: '1.1', mm: 1.1 }, gapMax: { text: '0.6', mm: 0.6 } } };
    const r = partFormToInput(typed, 'mm');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors.gapMaxMm).toBe('The largest gap must not be below the smallest.');
    expect(r.errors.resistorOhm).toMatch(/^Resistor must be a number/);
  });
});

describe('a line of the list of things to fix', () => {
  it('names the field with its unit and puts the unit after a bare limit', () => {
    expect(problemLine('existing.condenserUf', 'Condenser above 2 is not plausible.', 'Condenser (µF)')).toEqual({
      path: 'existing.condenserUf',
      name: 'Condenser (µF)',
      text: 'above 2 µF is not plausible.',
    });
    expect(problemLine('redlineRpm', 'Redline must be above idle speed.', 'Redline (rpm)').text).toBe('must be above idle speed.');
    // A message that already carries its unit is left as it is.
    expect(problemLine('boreMm', 'A bore over 200 mm is not plausible.', 'Bore (mm)').text).toBe('A bore over 200 mm is not plausible.');
  });

  it('reads the unit from the label, not from words such as "optional"', () => {
    expect(unitOfLabel('Redline (rpm)')).toBe('rpm');
    expect(unitOfLabel('Most heat it can shed (W, optional)')).toBe('W');
    expect(unitOfLabel('Coupling between the windings (optional, 0.9 to 1)')).toBeNull();
    expect(unitOfLabel('Turns ratio (to 1)')).toBeNull();
    expect(unitOfLabel('Name')).toBeNull();
  });
});
