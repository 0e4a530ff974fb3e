/**
 * Every check in one pass. A schema's checks that compare two fields ("redline above idle") only
 * run once every field is at least a number, so a letter typed in one box used to hide them until
 * it was mended. Here the form is read twice with each unreadable box standing in as a very low
 * and then a very high number: a cross-field message that comes out the same both times holds
 * whatever the box will hold and is shown now; one that comes and goes depends on the box still
 * to be mended and waits. The unreadable box keeps its own "type a number" message.
 */
import type { z } from 'zod';

export type Messages = Record<string, string>;

/** Stand-ins for a box that does not hold a number yet: below and above every plausible value. */
export const STAND_IN_LOW = -1e9;
export const STAND_IN_HIGH = 1e9;

/**
 * `build(standIn)` reads the form, puts `standIn` where a box is unreadable, and records that
 * box's own message in `own` (the same paths on every call). `toMessages` turns the schema's issues
 * into messages by path. Our own messages win over the schema's on the same path.
 */
export function checkInOnePass<T>(
  schema: z.ZodType<T>,
  build: (standIn: number) => unknown,
  own: Messages,
  toMessages: (error: z.ZodError) => Messages,
): { ok: true; input: T } | { ok: false; errors: Messages } {
  const low = schema.safeParse(build(STAND_IN_LOW));
  if (Object.keys(own).length === 0) {
    return low.success ? { ok: true, input: low.data } : { ok: false, errors: toMessages(low.error) };
  }
  const high = schema.safeParse(build(STAND_IN_HIGH));
  const fromLow = low.success ? {} : toMessages(low.error);
  const fromHigh = high.success ? {} : toMessages(high.error);
  const both: Messages = {};
  for (const [path, message] of Object.entries(fromLow)) {
    if (!(path in own) && fromHigh[path] === message) both[path] = message;
  }
  return { ok: false, errors: { ...both, ...own } };
}
