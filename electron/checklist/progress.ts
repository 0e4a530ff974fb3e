/**
 * Readings and ticks against a sheet: which step a quantity belongs to, where a reading stands
 * against its band (edges count as in), and how far the work has come.
 */
import type { Band, ExpectedReading, ReadingQuantity, Sheet, SheetProgress, SheetStep, TakenReading } from './types.js';

/** 'in' when min <= value <= max. A value that is not a finite number is refused, naming the field. */
export function judgeReading(r: ExpectedReading, value: number): Band {
  if (!Number.isFinite(value)) throw new RangeError('value: a reading must be a finite number.');
  if (value < r.min) return 'low';
  if (value > r.max) return 'high';
  return 'in';
}

export function stepForQuantity(sheet: Sheet, quantity: ReadingQuantity): SheetStep | undefined {
  for (const stage of sheet.stages) {
    for (const step of stage.steps) if (step.reading?.quantity === quantity) return step;
  }
  return undefined;
}

/** The latest reading of each quantity: the latest takenOn, then the highest id. */
export function latestByQuantity(readings: readonly TakenReading[]): Map<ReadingQuantity, TakenReading> {
  const out = new Map<ReadingQuantity, TakenReading>();
  for (const r of readings) {
    const best = out.get(r.quantity);
    if (!best || r.takenOn > best.takenOn || (r.takenOn === best.takenOn && r.id > best.id)) out.set(r.quantity, r);
  }
  return out;
}

/**
 * Ticks and readings against the sheet. A check step counts as in band when the latest reading of
 * its quantity is finite, in the step's unit (the store keeps each quantity in its one unit) and
 * inside the band.
 */
export function sheetProgress(sheet: Sheet, tickedKeys: ReadonlySet<string>, readings: readonly TakenReading[]): SheetProgress {
  const steps = sheet.stages.flatMap((s) => s.steps);
  const fitting = steps.filter((s) => s.fitting);
  const checks = steps.filter((s) => s.reading !== null);
  const latest = latestByQuantity(readings);
  let inBand = 0;
  for (const s of checks) {
    const r = latest.get(s.reading!.quantity);
    if (r && Number.isFinite(r.value) && r.unit === s.reading!.unit && judgeReading(s.reading!, r.value) === 'in') inBand++;
  }
  const fittingTicked = fitting.filter((s) => tickedKeys.has(s.key)).length;
  const wired = fittingTicked === fitting.length;
  return {
    fittingSteps: fitting.length,
    fittingTicked,
    checkSteps: checks.length,
    checksInBand: inBand,
    reached: wired ? (inBand === checks.length ? 'done' : 'wired') : 'none',
  };
}
