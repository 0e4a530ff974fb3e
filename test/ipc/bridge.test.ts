/**
 * The bridge end to end below the transport: `openBackend` on a real file in a temp folder, the
 * real dispatcher, the real handlers and repositories. Row counts are read through a second,
 * read-only SQLite connection to the same file, so "nothing changed" is checked on disk.
 */
import Database from 'better-sqlite3';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { demoEngines, demoParts, demoPlans } from '../../db/demo/index.js';
import { STORE_FILE_NAME } from '../../db/location.js';
import { SCHEMA_VERSION, closeStore, openStore } from '../../db/open.js';
import { channels, type ChannelName } from '../../electron/ipc/channels.js';
import { createDispatcher } from '../../electron/ipc/dispatch.js';
import { createHandlers } from '../../electron/ipc/handlers.js';
import { coilIn, engineIn, moduleIn, planIn, readingIn } from '../db/samples.js';
import { backendPerTest } from './backend-per-test.js';

const store = backendPerTest('bridge');
const { counts, call, ok } = store;

/** One malformed payload per channel, and a field key the error must name ('_' = the whole request). */
const malformed: Record<ChannelName, { payload: unknown; field: string }> = {
  'app.info': { payload: 'not an object', field: '_' },
  'demo.load': { payload: [], field: '_' },
  'engines.list': { payload: 42, field: '_' },
  'engines.get': { payload: { id: 0 }, field: 'id' },
  'engines.create': { payload: { engine: { ...engineIn(), boreMm: -5 } }, field: 'engine.boreMm' },
  'engines.update': { payload: { id: 1, expectedUpdatedAt: '2024-01-01T00:00:00.000Z', engine: { ...engineIn(), firingOrder: '1-2-3' } }, field: 'engine.firingOrder' },
  'engines.delete': { payload: { id: 1, expectedUpdatedAt: '2024-01-01T00:00:00.000Z' }, field: 'deletePlansToo' },
  'parts.list': { payload: { kind: 'spanner' }, field: 'kind' },
  'parts.get': { payload: { id: 'one' }, field: 'id' },
  'parts.create': { payload: { part: { ...coilIn, primaryResistanceOhm20C: 0 } }, field: 'part.primaryResistanceOhm20C' },
  'parts.update': { payload: { id: 1, expectedUpdatedAt: '2024-01-01T00:00:00.000Z', part: { kind: 'wrench', name: 'x', notes: '' } }, field: 'part.kind' },
  'parts.delete': { payload: { id: 1.5, expectedUpdatedAt: '2024-01-01T00:00:00.000Z' }, field: 'id' },
  'plans.list': { payload: { engineId: -1 }, field: 'engineId' },
  'plans.get': { payload: {}, field: 'id' },
  'plans.create': { payload: { plan: { ...planIn(1), status: 'finished' } }, field: 'plan.status' },
  'plans.update': { payload: { id: 1, expectedUpdatedAt: '2024-01-01T00:00:00.000Z', plan: { ...planIn(1), plugGapMm: 9 } }, field: 'plan.plugGapMm' },
  'plans.delete': { payload: { id: 1 }, field: 'expectedUpdatedAt' },
  'readings.list': { payload: { planId: '1' }, field: 'planId' },
  'readings.add': { payload: { reading: { ...readingIn(1), value: 'NaN' } }, field: 'reading.value' },
  'readings.delete': { payload: { id: -3, expectedUpdatedAt: '2024-01-01T00:00:00.000Z' }, field: 'id' },
  'readings.update': { payload: { id: 1, expectedUpdatedAt: '2024-01-01T00:00:00.000Z', reading: { ...readingIn(1), unit: 'furlong' } }, field: 'reading.unit' },
  'plans.setStatus': { payload: { id: 1, status: 'finished' }, field: 'status' },
  'store.unreadable': { payload: { all: true }, field: '_' },
  'settings.get': { payload: { lengthUnit: 'mm' }, field: '_' },
  'settings.set': { payload: { lengthUnit: 'cm' }, field: 'lengthUnit' },
  'engines.contents': { payload: { id: 2, plans: true }, field: '_' },
  'parts.usedBy': { payload: { id: 'seven' }, field: 'id' },
  'removed.list': { payload: { kind: 'engine' }, field: '_' },
  'removed.restore': { payload: { token: 0 }, field: 'token' },
  'check.cancel': { payload: { now: 1 }, field: '_' },
  'check.progress': { payload: [], field: '_' },
  'sheet.get': { payload: { planId: 1, colour: 'red' }, field: '_' },
  'sheet.tick': { payload: { planId: 1, stepKey: 'fit.coil\u0007', ticked: true }, field: 'stepKey' },
  'app.print': { payload: { pageSize: 'A3' }, field: 'pageSize' },
  'check.plans': { payload: { engineId: 1, planIds: [1, 2, 3, 4] }, field: 'planIds' },
  'check.search': { payload: { engineId: 1, top: 11 }, field: 'top' },
  'backup.create': { payload: { now: 'yes' }, field: '_' },
  'backup.list': { payload: [], field: '_' },
  'backup.restore': { payload: { name: 'workshop-2026-01-01T00-00-00-000Z-manual.sqlite3' }, field: 'confirmed' },
  'workshop.export': { payload: { format: 'xml' }, field: '_' },
  'workshop.importPreview': { payload: { text: '' }, field: 'text' },
  'workshop.import': { payload: { text: 42 }, field: 'text' },
  'parts.csvExport': { payload: { kind: 'spanner' }, field: 'kind' },
  'parts.csvImportPreview': { payload: { kind: 'coil' }, field: 'text' },
  'parts.csvImport': { payload: { kind: 'wrench', text: 'name' }, field: 'kind' },
};

describe('malformed requests', () => {
  it('has a malformed case here for every channel in the map', () => {
    expect(Object.keys(malformed).sort()).toEqual(Object.keys(channels).sort());
  });

  it.each(Object.entries(malformed))('%s: a malformed payload gets INVALID_INPUT with fields and changes no row', async (channel, { payload, field }) => {
    const before = counts();
    const r = await call(channel, payload);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('INVALID_INPUT');
    expect(r.error.message).toMatch(/\w/);
    expect(r.error.fields).toHaveProperty([field]);
    expect(counts()).toEqual(before);
  });
});

describe('unknown keys', () => {
  // The rule of the whole product: a key nobody asked for is refused, never silently dropped.
  it.each(Object.keys(channels))('%s: a request with a key the channel does not know is refused naming it, and changes no row', async (channel) => {
    const before = counts();
    const r = await call(channel, { unexpectedKey: 1 });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('INVALID_INPUT');
    // Named on the request as a whole, or (settings, whose keys are the setting names) under the key itself.
    expect(r.error.fields?.['_'] ?? r.error.fields?.['unexpectedKey']).toMatch(/unexpectedKey/);
    expect(counts()).toEqual(before);
  });
});

describe('unknown channels', () => {
  it.each(['engines.drop', 'toString', '__proto__', 42, null])('answers UNKNOWN_CHANNEL for %s and changes nothing', async (channel) => {
    const before = counts();
    const r = await call(channel, {});
    expect(r).toMatchObject({ ok: false, error: { code: 'UNKNOWN_CHANNEL' } });
    expect(counts()).toEqual(before);
  });
});

describe('happy paths', () => {
  it('reports the host, the data folder and the schema version', async () => {
    expect(await ok('app.info', {})).toEqual({ version: '0.1.0-test', dataDir: store.dir, schemaVersion: SCHEMA_VERSION, host: 'browser' });
    expect(store.backend.storeFile).toBe(join(store.dir, STORE_FILE_NAME));
  });

  it('opens a new data folder with the demo workshop, and loading it again adds nothing', async () => {
    expect(await ok('engines.list', {})).toHaveLength(demoEngines.length);
    expect(await ok('parts.list', {})).toHaveLength(demoParts.length);
    expect(await ok('plans.list', {})).toHaveLength(demoPlans.length);
    expect(await ok('demo.load', {})).toEqual({ enginesAdded: 0, partsAdded: 0, plansAdded: 0 });
  });

  it('does not reload the demo when the same folder is opened again after the user emptied it', async () => {
    for (const e of await ok('engines.list', {})) await ok('engines.delete', { id: e.id, deletePlansToo: true, expectedUpdatedAt: e.updatedAt });
    store.reopen('desktop');
    expect(await ok('engines.list', {})).toEqual([]);
  });

  it('creates a part, reads it back, and lists it under its kind', async () => {
    const created = await ok('parts.create', { part: { ...coilIn, name: 'Bridge coil' } });
    expect(await ok('parts.get', { id: created.id })).toEqual(created);
    expect((await ok('parts.list', { kind: 'coil' })).map((p: { id: number }) => p.id)).toContain(created.id);
  });

  it('refuses to delete an engine with plans until the user confirms, then reports how many plans went', async () => {
    const engines = await ok('engines.list', {});
    const withPlans = engines.find((e: { planCount: number }) => e.planCount > 0);
    const refused = await call('engines.delete', { id: withPlans.id, deletePlansToo: false, expectedUpdatedAt: withPlans.updatedAt });
    expect(refused).toMatchObject({ ok: false, error: { code: 'IN_USE' } });
    const before = counts();
    expect(await ok('engines.delete', { id: withPlans.id, deletePlansToo: true, expectedUpdatedAt: withPlans.updatedAt })).toEqual({ deleted: true, undoToken: expect.any(Number), plansDeleted: withPlans.planCount });
    expect(counts().plans).toBe(before.plans! - withPlans.planCount);
  });

  it('answers STALE, with a sentence, to a save or delete sent from a screen older than the record, and changes nothing', async () => {
    const seen = await ok('engines.create', { engine: engineIn() });
    const newer = await ok('engines.update', { id: seen.id, expectedUpdatedAt: seen.updatedAt, engine: { ...engineIn(), name: 'Saved first' } });
    const stale = await call('engines.update', { id: seen.id, expectedUpdatedAt: seen.updatedAt, engine: { ...engineIn(), name: 'Saved second' } });
    expect(stale).toMatchObject({ ok: false, error: { code: 'STALE', message: expect.stringMatching(/Reload/) } });
    const staleDelete = await call('engines.delete', { id: seen.id, expectedUpdatedAt: seen.updatedAt, deletePlansToo: true });
    expect(staleDelete).toMatchObject({ ok: false, error: { code: 'STALE' } });
    expect(await ok('engines.get', { id: seen.id })).toEqual(newer);
  });

  it('passes the store’s own field errors back under the request’s key', async () => {
    const engine = await ok('engines.create', { engine: engineIn() });
    const module = await ok('parts.create', { part: moduleIn });
    const r = await call('plans.create', { plan: planIn(engine.id, { coilId: module.id }) });
    expect(r).toMatchObject({ ok: false, error: { code: 'INVALID_INPUT', fields: { 'plan.coilId': expect.stringMatching(/not a coil/) } } });
  });

  it('answers NOT_FOUND for an id that names nothing', async () => {
    expect(await call('engines.get', { id: 999999 })).toMatchObject({ ok: false, error: { code: 'NOT_FOUND' } });
    expect(await call('readings.list', { planId: 999999 })).toMatchObject({ ok: false, error: { code: 'NOT_FOUND' } });
  });
});

describe('faults behind the bridge', () => {
  let file: string;
  let db: Database.Database;
  beforeEach(() => {
    file = join(store.dir, 'second.sqlite3');
    db = openStore(file);
  });
  afterEach(() => closeStore(db));
  const info = { version: 't', dataDir: '/nowhere', host: 'desktop' as const };

  it('turns a response that does not match its schema into INTERNAL, and reports it', async () => {
    const handlers = createHandlers(db, info);
    const real = handlers['engines.list'];
    // A handler bug: the summary loses its planCount.
    handlers['engines.list'] = (req) => (real(req) as Array<Record<string, unknown>>).map(({ planCount: _drop, ...rest }) => rest) as never;
    const reported: unknown[] = [];
    const dispatch = createDispatcher(handlers, (err) => reported.push(err));
    await dispatch('engines.create', { engine: engineIn() });
    const r = await dispatch('engines.list', {});
    expect(r).toMatchObject({ ok: false, error: { code: 'INTERNAL' } });
    expect(reported).toHaveLength(1);
  });

  it('turns a write SQLite refuses into STORE_ERROR with a plain sentence', async () => {
    db.exec(`CREATE TEMP TRIGGER refuse_parts BEFORE INSERT ON parts BEGIN SELECT RAISE(ABORT, 'refused'); END;`);
    const dispatch = createDispatcher(createHandlers(db, info));
    const r = await dispatch('parts.create', { part: coilIn });
    expect(r).toMatchObject({ ok: false, error: { code: 'STORE_ERROR', message: expect.stringMatching(/Nothing was changed/) } });
  });

  it('turns a corrupt stored row into STORE_ERROR naming its table and id', async () => {
    const dispatch = createDispatcher(createHandlers(db, info));
    const created = await dispatch('parts.create', { part: coilIn });
    const id = (created as { ok: true; value: { id: number } }).value.id;
    db.prepare(`UPDATE parts SET data = json_set(data, '$.turnsRatio', 'many') WHERE id = ?`).run(id);
    const r = await dispatch('parts.get', { id });
    expect(r).toMatchObject({ ok: false, error: { code: 'STORE_ERROR', message: expect.stringContaining(`id ${id} in the parts table`) } });
  });
});
