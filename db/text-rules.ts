/**
 * What typed text may hold. Zod's `.trim().min(1)` lets through a name made only of characters
 * nobody can see (zero-width spaces, a Hangul filler, a soft hyphen), text that reads differently
 * from what is stored (Unicode bidirectional embeddings, overrides and isolates: the "Trojan Source"
 * trick, CVE-2021-42574), control characters, and broken UTF-16 (a lone surrogate, which no file or
 * printer can encode). Each is refused with a sentence for the field. Applied to what a form or an
 * import sends, never to rows already stored (so nothing stored becomes unreadable).
 */
import type { z } from 'zod';

/** U+202A..U+202E (embeddings, overrides) and U+2066..U+2069 (isolates): Unicode bidi algorithm (UAX #9) explicit formatting. */
const BIDI_CONTROLS = /[\u202A-\u202E\u2066-\u2069]/;
/** A high surrogate not followed by a low one, or a low one not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
/** C0 and C1 controls and DEL; line breaks and tabs are allowed only where `multiLine`. */
const CONTROL_ONE_LINE = /[\u0000-\u001F\u007F-\u009F]/;
const CONTROL_MULTI_LINE = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;
/**
 * What cannot be seen on its own: white space, format characters (Cf: zero-width space/joiners,
 * soft hyphen, word joiner, BOM, tags), controls, combining marks with nothing to sit on, separators,
 * and the letters and symbols that are drawn blank (Hangul fillers U+115F, U+1160, U+3164, U+FFA0,
 * the blank braille pattern U+2800).
 */
const INVISIBLE = /[\s\p{Cf}\p{Cc}\p{Z}\p{M}\u115F\u1160\u3164\uFFA0\u2800]/gu;

export type TextField = {
  key: string;
  /** "The name", "The notes": starts the sentence. */
  words: string;
  /** Must hold something a person can see (names). */
  visible?: boolean;
  /** Line breaks and tabs allowed (notes). */
  multiLine?: boolean;
};

/** The sentence for one text value, or null when it is fine. */
export function textProblem(value: string, f: TextField): string | null {
  if (LONE_SURROGATE.test(value)) return `${f.words} holds a broken character (half of a surrogate pair); retype it.`;
  if (BIDI_CONTROLS.test(value)) return `${f.words} holds hidden text-direction characters, which can make it read differently from what is stored; remove them.`;
  if ((f.multiLine ? CONTROL_MULTI_LINE : CONTROL_ONE_LINE).test(value)) {
    return f.multiLine ? `${f.words} holds control characters; only ordinary text, line breaks and tabs are kept.` : `${f.words} holds control characters or line breaks; keep it to one line of ordinary text.`;
  }
  if (f.visible && value.replace(INVISIBLE, '') === '') return `${f.words} has no letters, digits or signs you can see; give it a name a person can read.`;
  return null;
}

/** A superRefine that checks the listed string fields of an object and reports each on its own field. */
export function textRules(fields: readonly TextField[]) {
  return (value: Record<string, unknown>, ctx: z.RefinementCtx): void => {
    for (const f of fields) {
      const v = value[f.key];
      if (typeof v !== 'string') continue;
      const problem = textProblem(v, f);
      if (problem) ctx.addIssue({ code: 'custom', path: [f.key], message: problem });
    }
  };
}
