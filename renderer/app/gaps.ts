/**
 * A gap (points or plug) as the person typed it, in the mm/inch choice, beside its exact value in
 * millimetres. The stored value is always mm; switching the unit re-shows the text only.
 */
import { parseNumberText } from './numbers.js';
import { gapText, unitToMm, type GapUnit } from './units.js';

/** A gap as typed, plus its exact value in mm (null while the text cannot be read). */
export type GapValue = { text: string; mm: number | null };

export function gapFromMm(mm: number | null, unit: GapUnit): GapValue {
  return { text: gapText(mm, unit), mm };
}

/** What the person typed into a gap box, read in the unit shown beside it. */
export function gapFromText(text: string, unit: GapUnit): GapValue {
  const p = parseNumberText(text, 'Gap');
  return { text, mm: p.ok ? unitToMm(p.value, unit) : null };
}

/** Re-shows a gap in another unit without changing the stored millimetres. */
export function regap(g: GapValue, unit: GapUnit): GapValue {
  return g.mm === null ? g : { text: gapText(g.mm, unit), mm: g.mm };
}

/** For "has anything changed?": a gap compared by its millimetres, not by its text. */
export const gapPrint = (g: GapValue): string => (g.mm === null ? `text:${g.text}` : `mm:${g.mm}`);
