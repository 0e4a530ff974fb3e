/**
 * The whole workshop as one workshop file (format.ts): every part, engine, plan, reading and tick,
 * read through the repositories. A row that cannot be read is left out and named in `unreadable`,
 * so an export of a damaged store still saves everything that can be saved.
 */
import type Database from 'better-sqlite3';
import { StoreError } from '../errors.js';
import { createRepositories } from '../repositories/index.js';
import { engineInput, partInput, planInput } from '../schema.js';
import { SCHEMA_VERSION_FOR_EXPORT } from './version.js';
import { WORKSHOP_FORMAT, WORKSHOP_FORMAT_VERSION } from './format.js';

export type ExportedWorkshop = {
  format: typeof WORKSHOP_FORMAT;
  version: typeof WORKSHOP_FORMAT_VERSION;
  exportedAt: string;
  appSchemaVersion: number;
  parts: Array<Record<string, unknown>>;
  engines: Array<Record<string, unknown>>;
};

export type ExportResult = { workshop: ExportedWorkshop; counts: { parts: number; engines: number; plans: number; readings: number; ticks: number }; unreadable: string[] };

export function exportWorkshop(db: Database.Database, now = new Date()): ExportResult {
  const unreadable: string[] = [];
  const repos = createRepositories(db, { onCorruptRow: (row) => unreadable.push(row.message) });
  const counts = { parts: 0, engines: 0, plans: 0, readings: 0, ticks: 0 };
  // One read transaction: the file is one moment of the workshop even if the app saves meanwhile.
  return db.transaction(() => {
    // Each record goes through its input schema, so only fields an import accepts are written.
    const parts = repos.parts.list().map((p) => ({ id: p.id, ...partInput.parse(p) }));
    counts.parts = parts.length;
    const engines: Array<Record<string, unknown>> = [];
    for (const summary of repos.engines.list()) {
      let engine;
      try {
        engine = repos.engines.get(summary.id);
      } catch (err) {
        if (err instanceof StoreError && err.code === 'CORRUPT') {
          unreadable.push(err.message);
          continue;
        }
        throw err;
      }
      const plans = repos.plans.list(summary.id).map((p) => {
        const { engineId: _e, ...plan } = planInput.parse(p);
        const readings = repos.readings.list(p.id).map((r) => ({ quantity: r.quantity, value: r.value, unit: r.unit, takenOn: r.takenOn, note: r.note }));
        const ticks = repos.ticks.list(p.id).map((t) => ({ stepKey: t.stepKey, tickedOn: t.tickedOn }));
        counts.readings += readings.length;
        counts.ticks += ticks.length;
        return { id: p.id, ...plan, readings, ticks };
      });
      counts.plans += plans.length;
      engines.push({ id: engine.id, ...engineInput.parse(engine), plans });
    }
    counts.engines = engines.length;
    const workshop: ExportedWorkshop = {
      format: WORKSHOP_FORMAT,
      version: WORKSHOP_FORMAT_VERSION,
      exportedAt: now.toISOString(),
      appSchemaVersion: SCHEMA_VERSION_FOR_EXPORT,
      parts,
      engines,
    };
    return { workshop, counts, unreadable };
  })();
}
