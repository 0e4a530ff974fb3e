/**
 * The child process the crash-safety test kills: it opens the workshop in `dataDir`, says
 * "ready", does one piece of work (a backup, an import or a restore), and says "done". The parent
 * SIGKILLs it at a random moment and then checks the folder. Run as
 * `node --import tsx test/db/crash/child.ts <backup|import|restore> <dataDir> [file]`.
 */
import { readFileSync } from 'node:fs';
import { createBackup, restoreBackup } from '../../../db/backup.js';
import { workshopImport } from '../../../db/exchange/index.js';
import { storeFileIn } from '../../../db/location.js';
import { closeStore, openStore } from '../../../db/open.js';

const [mode, dataDir, file] = process.argv.slice(2) as [string, string, string | undefined];
const storeFile = storeFileIn(dataDir);
let db = openStore(storeFile);
const input = mode === 'import' ? (JSON.parse(readFileSync(file!, 'utf8')) as unknown) : null;

process.stdout.write('ready\n');
const started = performance.now();
if (mode === 'backup') {
  for (let i = 0; i < 3; i++) await createBackup(db, dataDir, 'manual');
} else if (mode === 'import') {
  workshopImport(db, input);
} else if (mode === 'restore') {
  await restoreBackup({ db, file: storeFile, close: () => closeStore(db), reopen: () => (db = openStore(storeFile)) }, dataDir, file!);
} else {
  throw new Error(`unknown mode ${mode}`);
}
closeStore(db);
process.stdout.write(`done ${(performance.now() - started).toFixed(1)}\n`);
