/**
 * Issue 8, defect 2: a row that no longer parses was hidden from lists (a line on stderr only) and
 * could not be deleted. Now 'store.unreadable' names each such row with its reason and version,
 * and the delete requests remove it without parsing it. Real store files; rows damaged with raw SQL
 * the way a hand edit or another tool would.
 */
import Database from 'better-sqlite3';
import { describe, expect, it } from 'vitest';
import { backendPerTest } from './backend-per-test.js';

const store = backendPerTest('unreadable');
const { ok, call } = store;

function damage(sql: string, ...args: unknown[]): void {
  const db = new Database(store.backend.storeFile);
  db.prepare(sql).run(...args);
  db.close();
}

describe('rows that no longer parse', () => {
  it('are listed with their reason, left out of the lists, and can each be deleted with the version shown', async () => {
    expect(await ok('store.unreadable', {})).toEqual({ rows: [] });
    const parts = await ok('parts.list', {});
    const plans = await ok('plans.list', {});
    const engines = await ok('engines.list', {});
    const withPlan = plans[0];
    const readingsOf = await ok('readings.list', { planId: withPlan.id });

    // A part nothing uses, an engine without plans, a plan and a reading, each damaged.
    const used = new Set(plans.flatMap((p: Record<string, number | null>) => [p.moduleId, p.coilId, p.ballastId, p.tachId, p.leadsId, p.plugId]));
    const freePart = parts.find((p: { id: number }) => !used.has(p.id));
    const { id: _id, updatedAt: _at, ...first } = await ok('engines.get', { id: engines[0].id });
    const noParts = { coilPartId: null, ballastPartId: null, tachPartId: null, leadsPartId: null, plugPartId: null };
    const lonely = await ok('engines.create', { engine: { ...first, name: 'Lonely engine', existing: { ...first.existing, ...noParts } } });
    damage("UPDATE parts SET data = '{}' WHERE id = ?", freePart.id);
    damage("UPDATE engines SET existing = json_remove(existing, '$.plugGapMm') WHERE id = ?", lonely.id);
    damage('UPDATE plans SET plug_gap_mm = -1 WHERE id = ?', withPlan.id);
    const reading = await ok('readings.add', { reading: { planId: plans[1].id, quantity: 'coil-primary-resistance', value: 1.4, unit: 'ohm', takenOn: '2024-03-09', note: '' } });
    damage("UPDATE readings SET unit = 'furlong' WHERE id = ?", reading.id);

    const { rows } = await ok('store.unreadable', {});
    expect(rows.map((r: { table: string; id: number }) => `${r.table} ${r.id}`).sort()).toEqual(
      [`engines ${lonely.id}`, `parts ${freePart.id}`, `plans ${withPlan.id}`, `readings ${reading.id}`].sort(),
    );
    for (const r of rows) expect(r.message).toMatch(/could not be read/);
    expect(rows.find((r: { table: string }) => r.table === 'parts').label).toBe(`${freePart.kind}: ${freePart.name}`);

    // The lists leave them out (the engine list reads plain columns only, so the engine still shows).
    expect((await ok('parts.list', {})).some((p: { id: number }) => p.id === freePart.id)).toBe(false);
    expect((await ok('plans.list', {})).some((p: { id: number }) => p.id === withPlan.id)).toBe(false);
    expect((await ok('readings.list', { planId: plans[1].id })).some((r: { id: number }) => r.id === reading.id)).toBe(false);

    // Each is deleted with the version 'store.unreadable' gave, though it does not parse.
    const at = (table: string) => rows.find((r: { table: string }) => r.table === table);
    expect(await ok('parts.delete', { id: freePart.id, expectedUpdatedAt: at('parts').updatedAt })).toEqual({ deleted: true, undoToken: expect.any(Number) });
    expect(await ok('engines.delete', { id: lonely.id, expectedUpdatedAt: at('engines').updatedAt, deletePlansToo: false })).toEqual({ deleted: true, undoToken: expect.any(Number), plansDeleted: 0 });
    expect(await ok('plans.delete', { id: withPlan.id, expectedUpdatedAt: at('plans').updatedAt })).toEqual({ deleted: true, undoToken: expect.any(Number), readingsDeleted: readingsOf.length });
    expect(await ok('readings.delete', { id: reading.id, expectedUpdatedAt: at('readings').updatedAt })).toEqual({ deleted: true, undoToken: expect.any(Number) });
    expect(await ok('store.unreadable', {})).toEqual({ rows: [] });
  });

  it('a stale version still protects an unreadable row', async () => {
    const parts = await ok('parts.list', {});
    const plans = await ok('plans.list', {});
    const used = new Set(plans.flatMap((p: Record<string, number | null>) => [p.moduleId, p.coilId, p.ballastId, p.tachId, p.leadsId, p.plugId]));
    const freePart = parts.find((p: { id: number }) => !used.has(p.id));
    damage("UPDATE parts SET data = '{}', updated_at = '2030-01-01T00:00:00.000Z' WHERE id = ?", freePart.id);
    expect(await call('parts.delete', { id: freePart.id, expectedUpdatedAt: freePart.updatedAt })).toMatchObject({ ok: false, error: { code: 'STALE' } });
  });
});
