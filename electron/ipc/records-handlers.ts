/**
 * Handlers of the records channels (records-shapes.ts): backups, the workshop file and the parts
 * lists as CSV. They work on the live connection the backend hands them (`RecordsStore`), which a
 * restore replaces; the store's errors are translated like every other handler's.
 */
import type Database from 'better-sqlite3';
import { backupFileFor, createBackup, KEEP_LAST, KEEP_MONTHLY, listBackups, backupsDir, type BackupInfo } from '../../db/backup.js';
import { exportWorkshop, partsCsvExport, partsCsvImport, partsCsvPreview, workshopImport, workshopImportPreview } from '../../db/exchange/index.js';
import type { Handlers } from './dispatch.js';
import { AppFailure } from './failure.js';
import type { recordsChannels } from './records-shapes.js';

export type RecordsStore = {
  dataDir: string;
  /** The live connection (a restore replaces it). */
  db(): Database.Database;
  /** Replaces the workshop with the backup file (db/backup.ts restoreBackup) and reopens. */
  restore(backupFile: string): Promise<{ restored: string; safetyBackup: BackupInfo }>;
};

type RecordsHandlers = Pick<Handlers, keyof typeof recordsChannels>;

export const RECORDS_UNSUPPORTED = 'Backups, import and export need the app\'s own store; this host does not offer them.';

const view = ({ file: _file, ...info }: BackupInfo) => info;
const stamp = (): string => new Date().toISOString().slice(0, 19).replace(/:/g, '-');


/** JSON text as a value; bad JSON is refused on `text` with the parser's reason. */
function jsonOf(text: string): unknown {
  try {
    return JSON.parse(text) as unknown;
  } catch (err) {
    throw new AppFailure('INVALID_INPUT', 'The file was refused as a whole; nothing was written.', { text: `The file is not valid JSON (${(err as Error).message}).` });
  }
}

/** `translate` is handlers.ts's translateStoreError (passed in, so the two files do not import each other). */
export function recordsHandlers(store: RecordsStore | undefined, translate: (err: unknown) => unknown): RecordsHandlers {
  function guarded<A, R>(body: (request: A) => R | Promise<R>): (request: A) => Promise<R> {
    return async (request) => {
      try {
        return await body(request);
      } catch (err) {
        throw translate(err);
      }
    };
  }
  const need = (): RecordsStore => {
    if (!store) throw new AppFailure('UNSUPPORTED', RECORDS_UNSUPPORTED);
    return store;
  };
  return {
    'backup.create': guarded(async () => view(await createBackup(need().db(), need().dataDir, 'manual'))),
    'backup.list': guarded(() => ({
      folder: backupsDir(need().dataDir),
      keepLast: KEEP_LAST,
      keepMonthly: KEEP_MONTHLY,
      backups: listBackups(need().dataDir).map(view),
    })),
    'backup.restore': guarded(async (r) => {
      const s = need();
      const done = await s.restore(backupFileFor(s.dataDir, r.name));
      return { restored: done.restored, safetyBackup: view(done.safetyBackup) };
    }),
    'workshop.export': guarded(() => {
      const { workshop, counts, unreadable } = exportWorkshop(need().db());
      return { text: `${JSON.stringify(workshop, null, 2)}\n`, fileName: `workshop-${stamp()}.json`, counts, unreadable };
    }),
    'workshop.importPreview': guarded((r) => workshopImportPreview(need().db(), jsonOf(r.text))),
    // A refused file is refused before anything else; an accepted one gets a backup first.
    'workshop.import': guarded(async (r) => {
      const s = need();
      const raw = jsonOf(r.text);
      workshopImportPreview(s.db(), raw);
      await createBackup(s.db(), s.dataDir, 'before-import');
      return workshopImport(s.db(), raw);
    }),
    'parts.csvExport': guarded((r) => {
      const { csv, count } = partsCsvExport(need().db(), r.kind);
      return { csv, count, fileName: `parts-${r.kind}-${stamp()}.csv` };
    }),
    'parts.csvImportPreview': guarded((r) => partsCsvPreview(need().db(), r.kind, r.text)),
    'parts.csvImport': guarded(async (r) => {
      const s = need();
      partsCsvPreview(s.db(), r.kind, r.text);
      await createBackup(s.db(), s.dataDir, 'before-import');
      return partsCsvImport(s.db(), r.kind, r.text);
    }),
  };
}
