/** Building a step: the key from the stage and what it does, the unit from the quantity's one unit. */
import { QUANTITY_UNITS } from './units.js';
import type { ExpectedReading, SheetStep, StageId } from './types.js';

export type ReadingFields = Omit<ExpectedReading, 'unit'>;

/** A step that only does something (no reading). `fitting` steps count towards "wired". */
export function doStep(stage: StageId, what: string, title: string, text: string, terminals: string[], fitting = stage === 'fit' || stage === 'magneto'): SheetStep {
  return { key: `${stage}.${what}`, stage, title, text, terminals, fitting, reading: null };
}

/** A measuring step; its unit is the quantity's workshop unit. */
export function checkStep(stage: StageId, what: string, title: string, text: string, terminals: string[], reading: ReadingFields): SheetStep {
  return {
    key: `${stage}.${what}`,
    stage,
    title,
    text,
    terminals,
    fitting: false,
    reading: { ...reading, unit: QUANTITY_UNITS[reading.quantity] },
  };
}

/** Joins sentences, leaving out empty ones. */
export function sentences(...parts: Array<string | false | null | undefined>): string {
  return parts.filter((p): p is string => typeof p === 'string' && p.length > 0).join(' ');
}
