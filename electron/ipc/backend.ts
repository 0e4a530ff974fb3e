/**
 * Everything a transport needs, in one call: open the store in the data folder, load the demo on
 * the very first run, build the handlers and the dispatcher. The desktop shell and the browser
 * host both start here, so both serve the same store the same way.
 */
import { loadDemoIfFirstRun } from '../../db/demo/index.js';
import { storeFileIn } from '../../db/location.js';
import { closeStore, openStore } from '../../db/open.js';
import { createRepositories } from '../../db/repositories/index.js';
import { createDispatcher, type Dispatch } from './dispatch.js';
import { handlersFor, type HostInfo } from './handlers.js';

export type Backend = { dispatch: Dispatch; close(): void; storeFile: string };

/** `print` is the desktop shell's printing hook; without it 'app.print' answers UNSUPPORTED. */
export function openBackend(opts: { dataDir: string; host: 'desktop' | 'browser'; version: string; print?: HostInfo['print'] }): Backend {
  const storeFile = storeFileIn(opts.dataDir);
  const db = openStore(storeFile);
  try {
    const repos = createRepositories(db);
    loadDemoIfFirstRun(repos);
    const info: HostInfo = { version: opts.version, dataDir: opts.dataDir, host: opts.host };
    if (opts.print) info.print = opts.print;
    const handlers = handlersFor(repos, info);
    // A fault of ours goes to stderr; stdout is kept for the browser host's single ready line.
    const dispatch = createDispatcher(handlers, (err) => console.error('[backend] internal error:', err));
    return { dispatch, storeFile, close: () => closeStore(db) };
  } catch (err) {
    closeStore(db);
    throw err;
  }
}
