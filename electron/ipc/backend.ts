/**
 * Everything a transport needs, in one call: open the store in the data folder, load the demo on
 * the very first run, build the handlers and the dispatcher. The desktop shell and the browser
 * host both start here, so both serve the same store the same way.
 */
import { dailyBackupIfDue, restoreBackup } from '../../db/backup.js';
import { loadDemoIfFirstRun } from '../../db/demo/index.js';
import { lockDataDir } from '../../db/lock.js';
import { storeFileIn } from '../../db/location.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories } from '../../db/repositories/index.js';
import { createDispatcher, type Dispatch } from './dispatch.js';
import { handlersFor, type HostInfo } from './handlers.js';
import type { RecordsStore } from './records-handlers.js';

export type Backend = { dispatch: Dispatch; close(): void; storeFile: string };

/** `print` is the desktop shell's printing hook; without it 'app.print' answers UNSUPPORTED. */
export function openBackend(opts: { dataDir: string; host: 'desktop' | 'browser'; version: string; print?: HostInfo['print'] }): Backend {
  const storeFile = storeFileIn(opts.dataDir);
  // One app per folder: a second desktop app or browser host is refused here, before the store opens.
  const lock = lockDataDir(opts.dataDir, opts.host);
  let db: ReturnType<typeof openStore>;
  try {
    db = openStore(storeFile);
  } catch (err) {
    lock.release();
    throw err;
  }
  // A restore (db/backup.ts) closes the live connection, renames the restored file into place and
  // reopens it; the handlers are then rebuilt over the new connection. Requests that arrive
  // meanwhile are answered "a restore is under way" rather than touching a closed connection.
  let current: Dispatch;
  let restoring = false;
  let closed = false;
  const records: RecordsStore = {
    dataDir: opts.dataDir,
    db: () => db,
    restore: async (backupFile) => {
      restoring = true;
      try {
        return await restoreBackup(
          {
            db,
            file: storeFile,
            close: () => closeStore(db),
            reopen: () => {
              db = openStore(storeFile);
              current = build();
            },
          },
          opts.dataDir,
          backupFile,
        );
      } finally {
        restoring = false;
      }
    },
  };
  const build = (): Dispatch => {
    const info: HostInfo = { version: opts.version, dataDir: opts.dataDir, host: opts.host, records };
    if (opts.print) info.print = opts.print;
    const handlers = handlersFor(createRepositories(db), info);
    // A fault of ours goes to stderr; stdout is kept for the browser host's single ready line.
    return createDispatcher(handlers, (err) => console.error('[backend] internal error:', err));
  };
  try {
    const repos = createRepositories(db);
    const firstRun = loadDemoIfFirstRun(repos) !== null;
    current = build();
    // Once a day, on the first open of the day (not on the very first run: only the demo is there).
    if (!firstRun) {
      dailyBackupIfDue(db, opts.dataDir).catch((err: unknown) => {
        if (!closed) console.error('[backend] the daily backup failed:', err instanceof Error ? err.message : err);
      });
    }
    const dispatch: Dispatch = (channel, payload) =>
      restoring && channel !== 'app.info'
        ? Promise.resolve({ ok: false, error: { code: 'STORE_ERROR', message: 'A backup is being restored; try again in a moment.' } })
        : current(channel, payload);
    return {
      dispatch,
      storeFile,
      close: () => {
        closed = true;
        try {
          closeStore(db);
        } finally {
          lock.release();
        }
      },
    };
  } catch (err) {
    closeStore(db);
    lock.release();
    throw err;
  }
}
