/**
 * The records channels through the real backend (openBackend on a fresh folder, the demo loaded):
 * a backup listed with its counts, a restore that brings a deleted engine back through the same
 * dispatcher (the backend reopens the store under it), the workshop file previewed against the
 * same workshop (everything matches), and a CSV with one bad row refused with the row named.
 * No second connection is held open here: a restore refuses while another connection has the file.
 */
import Database from 'better-sqlite3';
import { afterEach, describe, expect, it } from 'vitest';
import { openBackend, type Backend } from '../../electron/ipc/backend.js';
import { tempDir } from '../db/samples.js';

let backend: Backend | null = null;
let cleanup: () => void = () => {};
afterEach(() => {
  backend?.close();
  backend = null;
  cleanup();
});

function start(label: string): Backend {
  const t = tempDir(label);
  cleanup = t.cleanup;
  backend = openBackend({ dataDir: t.dir, host: 'browser', version: '0.1.0-test' });
  return backend;
}

async function ok(b: Backend, channel: string, payload: unknown): Promise<any> {
  const r = await b.dispatch(channel, payload);
  if (!r.ok) throw new Error(`${channel} failed: ${JSON.stringify(r.error)}`);
  return r.value;
}

/** Engines in the store file, by the test's own SQL on a connection opened and closed at once. */
function engineCount(file: string): number {
  const db = new Database(file, { readonly: true });
  try {
    return (db.prepare('SELECT COUNT(*) AS n FROM engines').get() as { n: number }).n;
  } finally {
    db.close();
  }
}

describe('backups through the bridge', () => {
  it('backs up, lists with counts, and a restore brings a deleted engine back', async () => {
    const b = start('ipc-records-restore');
    const enginesBefore = engineCount(b.storeFile);
    const made = await ok(b, 'backup.create', {});
    expect(made.reason).toBe('manual');
    expect(made.counts.engines).toBe(enginesBefore);
    const list = await ok(b, 'backup.list', {});
    expect(list.backups.map((x: any) => x.name)).toEqual([made.name]);
    expect(list.keepLast).toBe(10);

    const victim = (await ok(b, 'engines.list', {}))[0];
    await ok(b, 'engines.delete', { id: victim.id, deletePlansToo: true, expectedUpdatedAt: victim.updatedAt });
    expect(engineCount(b.storeFile)).toBe(enginesBefore - 1);

    const restored = await ok(b, 'backup.restore', { name: made.name, confirmed: true });
    expect(restored.safetyBackup.counts.engines).toBe(enginesBefore - 1);
    // The same dispatcher now answers from the restored file.
    const names = (await ok(b, 'engines.list', {})).map((e: any) => e.name);
    expect(names).toContain(victim.name);
    expect(engineCount(b.storeFile)).toBe(enginesBefore);
    expect((await ok(b, 'backup.list', {})).backups).toHaveLength(2);
  });

  it('makes the daily backup on the next open, not on the very first run', async () => {
    const first = start('ipc-records-daily');
    await new Promise((r) => setTimeout(r, 300));
    expect((await ok(first, 'backup.list', {})).backups).toEqual([]);
    const dir = (await ok(first, 'app.info', {})).dataDir as string;
    first.close();
    backend = openBackend({ dataDir: dir, host: 'browser', version: '0.1.0-test' });
    let backups: any[] = [];
    for (let i = 0; i < 50 && backups.length === 0; i++) {
      await new Promise((r) => setTimeout(r, 100));
      backups = (await ok(backend, 'backup.list', {})).backups;
    }
    expect(backups.map((b) => b.reason)).toEqual(['daily']);
    expect(backups[0].counts.engines).toBe(engineCount(backend.storeFile));
  });

  it('refuses a name that is not in the list, and a restore without the question asked', async () => {
    const b = start('ipc-records-refuse');
    const r = await b.dispatch('backup.restore', { name: '../workshop.sqlite3', confirmed: true });
    expect(r.ok === false && r.error.code).toBe('INVALID_INPUT');
    const r2 = await b.dispatch('backup.restore', { name: 'x', confirmed: false });
    expect(r2.ok === false && r2.error.fields).toHaveProperty('confirmed');
  });
});

describe('the workshop file and the parts CSV through the bridge', () => {
  it('an export previewed against the same workshop matches everything', async () => {
    const b = start('ipc-records-export');
    const exported = await ok(b, 'workshop.export', {});
    expect(exported.fileName).toMatch(/^workshop-.*\.json$/);
    const preview = await ok(b, 'workshop.importPreview', { text: exported.text });
    expect(preview.added).toEqual({ parts: 0, engines: 0, plans: 0, readings: 0, ticks: 0 });
    expect(preview.skipped).toBe(exported.counts.parts + exported.counts.engines + exported.counts.plans);
    const bad = await b.dispatch('workshop.import', { text: '{ not json' });
    expect(bad.ok === false && bad.error.fields?.['text']).toMatch(/not valid JSON/);
  });

  it('a CSV with one bad row is refused with the row named and nothing added', async () => {
    const b = start('ipc-records-csv');
    const coils = (await ok(b, 'parts.list', { kind: 'coil' })).length;
    const { csv } = await ok(b, 'parts.csvExport', { kind: 'coil' });
    const lines = csv.trim().split('\n');
    const header = lines[0];
    // The last column is "how many" (store version 5), left blank: one each.
    const text = [header, 'New coil A,,3,8,7500,80,,no,12,,,', 'New coil B,,0,8,7500,80,,no,12,,,'].join('\n');
    const r = await b.dispatch('parts.csvImport', { kind: 'coil', text });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('INVALID_INPUT');
    expect(r.error.fields).toEqual({ 'row 3, primary resistance': 'must be more than zero.' });
    expect((await ok(b, 'parts.list', { kind: 'coil' })).length).toBe(coils);
  });
});
