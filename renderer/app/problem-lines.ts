/**
 * One line of the list of things to fix: the field as the form labels it, unit included
 * ("Condenser (µF)"), then what is wrong without saying the field's name twice, with the unit
 * after a bare limit ("above 2 µF is not plausible."). Pure, so it is tested on its own.
 */
export type ProblemLine = { path: string; name: string; text: string };

/** The unit in a label's brackets: "Redline (rpm)" -> "rpm", "(W, optional)" -> "W"; none for "(optional)" or "(to 1)". */
export function unitOfLabel(label: string): string | null {
  const m = /\(([^()]*)\)\s*$/.exec(label);
  const first = m?.[1]?.split(',')[0]?.trim();
  if (!first || first === 'optional' || first.startsWith('to ')) return null;
  return first;
}

const escape = (s: string): string => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

export function problemLine(path: string, message: string, label: string | undefined): ProblemLine {
  if (!label) return { path, name: '', text: message };
  const base = label.replace(/\s*\([^()]*\)\s*$/, '').trim();
  let text = message;
  const lead = new RegExp(`^${escape(base)}\\s+`, 'i');
  if (base && lead.test(text)) text = text.replace(lead, '');
  const unit = unitOfLabel(label);
  if (unit && !text.includes(unit)) {
    // A bare limit gets the field's unit: "above 2 is not plausible" -> "above 2 µF is not plausible".
    text = text.replace(/\b(above|below|over|under|than|least|most|from|to) (-?\d[\d,]*(?:\.\d+)?)(?!\d|\.\d)/g, `$1 $2 ${unit}`);
  }
  return { path, name: label, text };
}

/** Every message as a line, in the order given. */
export function problemLines(messages: Record<string, string>, nameOf: (path: string) => string | undefined): ProblemLine[] {
  return Object.entries(messages).map(([path, message]) => problemLine(path, message, nameOf(path)));
}
