/**
 * judgeReading and sheetProgress on hand-made sheets: the band's edges count as in, the latest
 * reading of a quantity wins (latest date, then the highest id), 'wired' when every fitting step is
 * ticked, 'done' when also every check reading is in band. These are the contract's own rules
 * (notes/contract.md, piece A); the cases are made by hand here.
 */
import { describe, expect, it } from 'vitest';
import { judgeReading, sheetProgress, stepForQuantity } from '../../electron/checklist/index.js';
import type { ExpectedReading, Sheet, SheetStep, TakenReading } from '../../electron/checklist/types.js';

function reading(quantity: ExpectedReading['quantity'], unit: ExpectedReading['unit'], min: number, max: number): ExpectedReading {
  return { quantity, unit, expected: (min + max) / 2, min, max, probes: '', state: '', how: '', source: 'hand-made', ifOutOfRange: [] };
}

function step(key: string, fitting: boolean, r: ExpectedReading | null): SheetStep {
  return { key, stage: fitting ? 'fit' : 'static', title: key, text: '', terminals: [], fitting, reading: r };
}

const battery = reading('battery-voltage-resting', 'V', 12.4, 12.7);
const primary = reading('coil-primary-resistance', 'ohm', 2.7, 3.3);

const sheet: Sheet = {
  header: {} as Sheet['header'],
  cautions: [],
  diagram: { width: 1000, height: 620, parts: [], wires: [], notes: [] },
  stages: [
    { id: 'fit', title: 'Fit', intro: '', steps: [step('fit.a', true, null), step('fit.b', true, null), step('fit.note', false, null)] },
    { id: 'static', title: 'Static', intro: '', steps: [step('static.battery', false, battery), step('static.primary', false, primary)] },
  ],
};

let id = 0;
const taken = (quantity: TakenReading['quantity'], value: number, takenOn: string, unit = 'V', rid?: number): TakenReading => ({ id: rid ?? ++id, quantity, value, unit, takenOn });

describe('judgeReading', () => {
  it('counts both band edges as in (contract: in when min <= value <= max)', () => {
    expect(judgeReading(battery, 12.4)).toBe('in');
    expect(judgeReading(battery, 12.7)).toBe('in');
    expect(judgeReading(battery, 12.55)).toBe('in');
  });
  it('is low just under the band and high just over it', () => {
    expect(judgeReading(battery, 12.399)).toBe('low');
    expect(judgeReading(battery, 12.701)).toBe('high');
  });
  it('refuses a value that is not a number, naming the field', () => {
    expect(() => judgeReading(battery, Number.NaN)).toThrow(/value/);
  });
});

describe('stepForQuantity', () => {
  it('finds the one step that asks for a quantity, and nothing for one no step asks for', () => {
    expect(stepForQuantity(sheet, 'coil-primary-resistance')?.key).toBe('static.primary');
    expect(stepForQuantity(sheet, 'dwell-angle')).toBeUndefined();
  });
});

describe('sheetProgress', () => {
  it('nothing ticked, nothing read: none', () => {
    expect(sheetProgress(sheet, new Set(), [])).toEqual({ fittingSteps: 2, fittingTicked: 0, checkSteps: 2, checksInBand: 0, reached: 'none' });
  });
  it('a non-fitting step ticked does not count towards wired', () => {
    expect(sheetProgress(sheet, new Set(['fit.a', 'fit.note']), []).fittingTicked).toBe(1);
    expect(sheetProgress(sheet, new Set(['fit.a', 'fit.note']), []).reached).toBe('none');
  });
  it('every fitting step ticked: wired', () => {
    expect(sheetProgress(sheet, new Set(['fit.a', 'fit.b']), []).reached).toBe('wired');
  });
  it('wired and every check in band: done', () => {
    const p = sheetProgress(sheet, new Set(['fit.a', 'fit.b']), [taken('battery-voltage-resting', 12.7, '2024-03-01'), taken('coil-primary-resistance', 2.7, '2024-03-01', 'ohm')]);
    expect(p).toEqual({ fittingSteps: 2, fittingTicked: 2, checkSteps: 2, checksInBand: 2, reached: 'done' });
  });
  it('all readings in band but a fitting step unticked: none', () => {
    const p = sheetProgress(sheet, new Set(['fit.a']), [taken('battery-voltage-resting', 12.6, '2024-03-01'), taken('coil-primary-resistance', 3.0, '2024-03-01', 'ohm')]);
    expect(p.checksInBand).toBe(2);
    expect(p.reached).toBe('none');
  });
  it('the latest date wins over an earlier reading, whatever the order given', () => {
    const late = taken('battery-voltage-resting', 11.9, '2024-03-05');
    const early = taken('battery-voltage-resting', 12.6, '2024-03-01');
    const p = sheetProgress(sheet, new Set(['fit.a', 'fit.b']), [late, early, taken('coil-primary-resistance', 3.0, '2024-03-01', 'ohm')]);
    expect(p.checksInBand).toBe(1);
    expect(p.reached).toBe('wired');
  });
  it('on the same date the highest id wins', () => {
    const a = taken('battery-voltage-resting', 12.6, '2024-03-05', 'V', 7);
    const b = taken('battery-voltage-resting', 13.5, '2024-03-05', 'V', 9);
    expect(sheetProgress(sheet, new Set(), [b, a]).checksInBand).toBe(0);
    const c = taken('battery-voltage-resting', 12.6, '2024-03-05', 'V', 11);
    expect(sheetProgress(sheet, new Set(), [b, c, a]).checksInBand).toBe(1);
  });
  it('a reading of a quantity no step asks for changes nothing', () => {
    expect(sheetProgress(sheet, new Set(), [taken('dwell-angle', 60, '2024-03-05', 'deg')]).checksInBand).toBe(0);
  });
  it('a reading in another unit than the step is not judged in band', () => {
    expect(sheetProgress(sheet, new Set(), [taken('coil-primary-resistance', 3.0, '2024-03-05', 'kohm')]).checksInBand).toBe(0);
  });
});
