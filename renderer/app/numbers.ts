/**
 * Turning typed text into numbers without ever producing NaN. A form keeps what the person typed
 * as text; only when it is checked or saved is the text read, and anything unreadable gets a
 * sentence saying what to type instead.
 */
export type Parsed = { ok: true; value: number } | { ok: false; message: string };

const plainNumber = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/** Reads one number; `label` names the quantity in the message ("Bore"). */
export function parseNumberText(text: string, label: string): Parsed {
  const t = text.trim();
  if (t === '') return { ok: false, message: `${label} is needed: type a number.` };
  if (/^[+-]?\d*,\d+$/.test(t)) {
    return { ok: false, message: `Write decimals with a point, not a comma: ${t.replace(',', '.')} rather than ${t}.` };
  }
  if (!plainNumber.test(t)) return { ok: false, message: `${label} must be a number, for example 12 or 0.4.` };
  const value = Number(t);
  if (!Number.isFinite(value)) return { ok: false, message: `${label} is too large to be a real value.` };
  return { ok: true, value };
}

/** Like parseNumberText, but blank means "not given" (null). */
export function parseOptionalNumberText(text: string, label: string): Parsed | { ok: true; value: null } {
  return text.trim() === '' ? { ok: true, value: null } : parseNumberText(text, label);
}

/** Shows a stored number without float noise (0.30000000000000004 -> "0.3"). */
export function numberToText(value: number | null | undefined, maxDecimals = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return String(Number(value.toFixed(maxDecimals)));
}
