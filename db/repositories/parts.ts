/**
 * The parts bin: one table for every kind. `kind`, `name` and `notes` are columns; the fields that
 * differ by kind are JSON in `data`, re-parsed with the kind's zod schema on every read.
 */
import type { z } from 'zod';
import { part as partSchema, partInput, partKind, type Part, type PartInput, type PartKind } from '../schema.js';
import { StoreError } from '../errors.js';
import { checkVersion, INVALID_SENTENCE, nextStamp, nowIso, parseInput, parseJsonColumn, parseStored, plural, readAll, writeTx, type RepoContext } from './shared.js';

export type PartsRepository = {
  list(kind?: PartKind): Part[];
  get(id: number): Part;
  create(input: PartInput): Part;
  /** STALE if the part changed since `expectedUpdatedAt` (the `updatedAt` the user saw). */
  update(id: number, input: PartInput, expectedUpdatedAt: string): Part;
  /** Refused with IN_USE while a plan or an engine's existing setup refers to the part; STALE as update. Works on a row that no longer parses. */
  delete(id: number, expectedUpdatedAt: string): { deleted: true };
  /** Who names the part (plans, engines' existing setups), in words; empty when it is free to delete. */
  usedBy(id: number): string[];
  /** The first part of this kind with exactly this name (after trimming), or null. */
  findByName(kind: PartKind, name: string): Part | null;
  count(): number;
};

type PartRow = { id: number; kind: string; name: string; notes: string; data: string; quantity: number; updated_at: string };

/** The parts of an engine's existing setup live in its JSON; these are the keys that name a part. */
const EXISTING_PART_KEYS = ['coilPartId', 'ballastPartId', 'tachPartId', 'leadsPartId', 'plugPartId'] as const;

/** `p` as parsed by `partInput` (so `quantity` is filled in); the kind's own fields go into `data`. */
function splitPart(p: z.output<typeof partInput>): { kind: PartKind; name: string; notes: string; quantity: number; data: string } {
  const { kind, name, notes, quantity, ...rest } = p;
  return { kind, name, notes, quantity, data: JSON.stringify(rest) };
}

export function createPartsRepository(ctx: RepoContext): PartsRepository {
  const { db } = ctx;
  const select = 'SELECT id, kind, name, notes, data, quantity, updated_at FROM parts';
  const s = {
    all: db.prepare<[], PartRow>(`${select} ORDER BY kind, name COLLATE NOCASE, id`),
    byKind: db.prepare<[string], PartRow>(`${select} WHERE kind = ? ORDER BY name COLLATE NOCASE, id`),
    get: db.prepare<[number], PartRow>(`${select} WHERE id = ?`),
    byName: db.prepare<[string, string], PartRow>(`${select} WHERE kind = ? AND name = ? ORDER BY id LIMIT 1`),
    insert: db.prepare('INSERT INTO parts (kind, name, notes, data, quantity, created_at, updated_at) VALUES (@kind, @name, @notes, @data, @quantity, @now, @now)'),
    update: db.prepare('UPDATE parts SET kind = @kind, name = @name, notes = @notes, data = @data, quantity = @quantity, updated_at = @now WHERE id = @id'),
    remove: db.prepare('DELETE FROM parts WHERE id = ?'),
    count: db.prepare<[], { n: number }>('SELECT COUNT(*) AS n FROM parts'),
    plansUsing: db.prepare<{ id: number }, { id: number; name: string }>(
      `SELECT id, name FROM plans
        WHERE module_id = @id OR coil_id = @id OR ballast_id = @id OR tach_id = @id OR leads_id = @id OR plug_id = @id
        ORDER BY id`,
    ),
    enginesUsing: db.prepare<{ id: number }, { id: number; name: string }>(
      `SELECT id, name FROM engines WHERE ${EXISTING_PART_KEYS.map((k) => `json_extract(existing, '$.${k}') = @id`).join(' OR ')} ORDER BY id`,
    ),
  };

  function fromRow(row: PartRow): Part {
    const data = parseJsonColumn('parts', row.id, 'data', row.data);
    const spread = typeof data === 'object' && data !== null ? data : {};
    // Columns win over anything of the same name inside `data`.
    return parseStored(partSchema, 'parts', row.id, { ...spread, kind: row.kind, name: row.name, notes: row.notes, quantity: row.quantity, id: row.id, updatedAt: row.updated_at });
  }

  function read(id: number): Part {
    const row = s.get.get(id);
    if (!row) throw new StoreError('NOT_FOUND', `There is no part with id ${id}; it may have been deleted.`);
    return fromRow(row);
  }

  function users(id: number): string[] {
    const plans = s.plansUsing.all({ id });
    const engines = s.enginesUsing.all({ id });
    const out: string[] = [];
    if (plans.length > 0) out.push(`${plural(plans.length, 'plan', 'plans')} (${plans.map((p) => p.name).join(', ')})`);
    if (engines.length > 0) out.push(`the existing setup of ${plural(engines.length, 'engine', 'engines')} (${engines.map((e) => e.name).join(', ')})`);
    return out;
  }

  // Reads the raw row only (never parses `data`), so a part that no longer parses can still be deleted.
  const deleteTx = (id: number, expected: string) => {
    const current = s.get.get(id);
    if (!current) throw new StoreError('NOT_FOUND', `There is no part with id ${id}; it may have been deleted.`);
    checkVersion('part', id, current.updated_at, expected, true);
    const usedBy = users(id);
    if (usedBy.length > 0) {
      throw new StoreError('IN_USE', `"${current.name}" is used by ${usedBy.join(' and ')}. Take it out of those first, then delete it.`);
    }
    s.remove.run(id);
    return { deleted: true as const };
  };

  const updateTx = (id: number, input: unknown, expected: string) => {
    const row = s.get.get(id);
    if (!row) throw new StoreError('NOT_FOUND', `There is no part with id ${id}; it may have been deleted.`);
    checkVersion('part', id, row.updated_at, expected, false);
    const p = parseInput(partInput, input);
    if (row.kind !== p.kind) {
      // A plan's coil_id must keep naming a coil; changing the kind under it would make it lie.
      const usedBy = users(id);
      if (usedBy.length > 0) {
        throw new StoreError('INVALID_INPUT', INVALID_SENTENCE, { kind: `This part is used by ${usedBy.join(' and ')}, so its kind cannot change.` });
      }
    }
    s.update.run({ ...splitPart(p), now: nextStamp(row.updated_at), id });
    return read(id);
  };

  return {
    list: (kind) => {
      const rows = kind === undefined ? s.all.all() : s.byKind.all(parseInput(partKind, kind));
      return readAll(ctx, 'parts', rows, fromRow);
    },
    get: (id) => read(id),
    create: (input) =>
      writeTx(db, () => {
        const p = parseInput(partInput, input);
        return read(Number(s.insert.run({ ...splitPart(p), now: nowIso() }).lastInsertRowid));
      }),
    update: (id, input, expectedUpdatedAt) => writeTx(db, () => updateTx(id, input, expectedUpdatedAt)),
    delete: (id, expectedUpdatedAt) => writeTx(db, () => deleteTx(id, expectedUpdatedAt)),
    usedBy: (id) => db.transaction(() => users(id))(),
    findByName: (kind, name) => {
      const row = s.byName.get(kind, name.trim());
      return row ? fromRow(row) : null;
    },
    count: () => s.count.get()!.n,
  };
}
