/**
 * Helpers every repository uses: input validation at the store boundary, the corrupt-row report,
 * and the check that a referenced part exists and is of the kind the field expects.
 */
import type Database from 'better-sqlite3';
import type { z } from 'zod';
import { fieldMessages, type PartKind } from '../schema.js';
import { StoreError } from '../errors.js';

/** A stored row that no longer matches its schema (for example a file edited by hand). */
export type CorruptRow = { table: string; id: number; message: string };

export type RepoContext = {
  db: Database.Database;
  /** Called for each row a list leaves out because it cannot be read. */
  onCorruptRow: (row: CorruptRow) => void;
};

/**
 * Runs `fn` as a write transaction started IMMEDIATE: the write lock is taken at BEGIN, so a second
 * process waits (busy_timeout) for it instead of failing with SQLITE_BUSY_SNAPSHOT half-way
 * (sqlite.org/lang_transaction.html). Inside another transaction it becomes a savepoint.
 */
export function writeTx<T>(db: Database.Database, fn: () => T): T {
  return db.transaction(fn).immediate();
}

export const INVALID_SENTENCE = 'Some values need correcting before this can be saved.';

export function nowIso(): string {
  return new Date().toISOString();
}

/**
 * The time a changed record gets: now, or 1 ms after its previous time if the clock has not moved
 * past it (two saves in one millisecond, or a clock set back), so every save gives a new version.
 */
export function nextStamp(previous: string): string {
  const now = nowIso();
  if (now > previous) return now;
  const prev = Date.parse(previous);
  return Number.isNaN(prev) ? now : new Date(prev + 1).toISOString();
}

export type RecordWord = 'engine' | 'part' | 'plan' | 'reading';

/**
 * Refuses a write made from a stale screen: `expected` is the `updatedAt` the user saw, `stored`
 * the row's `updated_at` now. Nothing has been written when this throws.
 */
export function checkVersion(what: RecordWord, id: number, stored: string, expected: string, deleting: boolean): void {
  if (stored === expected) return;
  throw new StoreError(
    'STALE',
    deleting
      ? `This ${what} was changed somewhere else after you opened it, so it was not deleted. Reload it to see the newer version, then delete it if you still want to.`
      : `This ${what} was changed somewhere else after you opened it, so your changes were not saved (they would have overwritten the newer ones). Reload it to see the newer version, then make your changes again.`,
  );
}

/** Parse what a caller wants to store; anything wrong is INVALID_INPUT with one message per field. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const parsed = schema.safeParse(input);
  if (!parsed.success) throw new StoreError('INVALID_INPUT', INVALID_SENTENCE, fieldMessages(parsed.error));
  return parsed.data;
}

/** Parse what was read back; a mismatch names the table, the row and the first field at fault. */
export function parseStored<S extends z.ZodType>(schema: S, table: string, id: number, value: unknown): z.output<S> {
  const parsed = schema.safeParse(value);
  if (parsed.success) return parsed.data;
  const [field, message] = Object.entries(fieldMessages(parsed.error))[0] ?? ['_', 'unreadable'];
  throw new StoreError(
    'CORRUPT',
    `The row with id ${id} in the ${table} table could not be read (${field}: ${message}). The file was not changed; restore a backup or delete this record.`,
  );
}

/** JSON.parse that reports a broken column as CORRUPT instead of a SyntaxError. */
export function parseJsonColumn(table: string, id: number, column: string, text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    throw new StoreError('CORRUPT', `The ${column} of the row with id ${id} in the ${table} table is not valid JSON. The file was not changed.`);
  }
}

/** Read each row; skip (and report) the ones that cannot be read, so one bad row never hides the rest. */
export function readAll<Row extends { id: number }, T>(ctx: RepoContext, table: string, rows: Row[], read: (row: Row) => T): T[] {
  const out: T[] = [];
  for (const row of rows) {
    try {
      out.push(read(row));
    } catch (err) {
      if (err instanceof StoreError && err.code === 'CORRUPT') ctx.onCorruptRow({ table, id: row.id, message: err.message });
      else throw err;
    }
  }
  return out;
}

export type PartRef = { field: string; id: number | null; kind: PartKind };

const KIND_WORD: Record<PartKind, string> = {
  coil: 'a coil',
  ballast: 'a ballast resistor',
  module: 'an ignition module',
  tach: 'a tachometer',
  leads: 'a set of HT leads',
  plug: 'a spark plug',
};

/** A checker for part references: each must name a stored part of the expected kind. */
export function partRefChecker(db: Database.Database): (refs: PartRef[]) => void {
  const kindOf = db.prepare<[number], { kind: PartKind }>('SELECT kind FROM parts WHERE id = ?');
  return (refs) => {
    const fields: Record<string, string> = {};
    for (const ref of refs) {
      if (ref.id === null) continue;
      const row = kindOf.get(ref.id);
      if (!row) fields[ref.field] = `There is no part with id ${ref.id} in the parts bin.`;
      else if (row.kind !== ref.kind) fields[ref.field] = `Part ${ref.id} is ${KIND_WORD[row.kind]}, not ${KIND_WORD[ref.kind]}.`;
    }
    if (Object.keys(fields).length > 0) throw new StoreError('INVALID_INPUT', INVALID_SENTENCE, fields);
  };
}

export function plural(n: number, one: string, many: string): string {
  return `${n} ${n === 1 ? one : many}`;
}
