/**
 * The browser host: the same channel map as the desktop window, served on 127.0.0.1 for a plain
 * browser (the end-to-end tests, and anyone without Electron).
 *
 *   npx tsx electron/web-host.ts --data-dir DIR [--port N]
 *
 * Prints exactly one line on stdout once ready, `Serving at http://127.0.0.1:<port>/#token=<hex>`;
 * everything else goes to stderr. SIGINT and SIGTERM close the store before exiting.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { STORE_FILE_NAME } from '../db/location.js';
import { describeStartupProblem, type WayOut } from '../db/startup-problem.js';
import { openBackend } from './ipc/backend.js';
import { HostArgsError, parseHostArgs } from './host/args.js';
import { createHostServer } from './host/server.js';
import { newToken } from './host/token.js';

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const staticRoot = path.join(projectRoot, 'dist', 'renderer');

function appVersion(): string {
  const pkg = JSON.parse(readFileSync(path.join(projectRoot, 'package.json'), 'utf8')) as { version?: unknown };
  return typeof pkg.version === 'string' ? pkg.version : '0.0.0';
}

/** The ways out, in the browser host's own terms (the desktop app offers them as buttons). */
const WAY_OUT_HERE: Record<WayOut, string> = {
  'newest-backup': 'Open this folder in the desktop app: it offers to put the newest backup in place (the damaged file is kept beside it, renamed with the date).',
  'read-only-export': 'Open this folder in the desktop app: it offers to open the file read-only and export what can still be read.',
  'other-folder': 'Start on another folder: --data-dir <another folder>.',
  'close-other': 'Close the other copy of the app using this folder, then start again.',
  'update-app': 'Install a newer version of the app.',
};

function main(): void {
  let args;
  try {
    args = parseHostArgs(process.argv.slice(2), process.env);
  } catch (err) {
    if (err instanceof HostArgsError) {
      console.error(err.message);
      process.exit(2);
    }
    throw err;
  }

  let backend: ReturnType<typeof openBackend>;
  try {
    backend = openBackend({ dataDir: args.dataDir, host: 'browser', version: appVersion() });
  } catch (err) {
    // A plain sentence with the file's path and what to do; never SQLite's own words alone.
    const problem = describeStartupProblem(err, path.join(args.dataDir, STORE_FILE_NAME), args.dataDir);
    console.error(problem.sentence);
    console.error(problem.waysOut.map((w) => `- ${WAY_OUT_HERE[w]}`).join('\n'));
    process.exit(1);
  }

  const token = newToken();
  const server = createHostServer({
    token,
    dispatch: backend.dispatch,
    staticRoot,
    onError: (err) => console.error('The host failed to answer a request:', err),
  });

  let closing = false;
  const shutDown = (signal: string) => {
    if (closing) return;
    closing = true;
    server.close();
    server.closeAllConnections();
    try {
      backend.close();
    } catch (err) {
      console.error('Closing the store failed:', err);
      process.exit(1);
    }
    console.error(`Stopped on ${signal}; the store is closed.`);
    process.exit(0);
  };
  process.on('SIGINT', () => shutDown('SIGINT'));
  process.on('SIGTERM', () => shutDown('SIGTERM'));

  server.on('error', (err) => {
    console.error(`The host could not listen on 127.0.0.1:${args.port}: ${err.message}`);
    backend.close();
    process.exit(1);
  });
  server.listen(args.port, '127.0.0.1', () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : args.port;
    console.error(`Store: ${backend.storeFile}`);
    process.stdout.write(`Serving at http://127.0.0.1:${port}/#token=${token}\n`);
  });
}

main();
