/**
 * Where the workshop file lives. The desktop shell and the browser host both pass their argv and
 * environment here, so `--data-dir` means the same thing on both.
 */
import { mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';

export const STORE_FILE_NAME = 'workshop.sqlite3';
const FLAG = '--data-dir';

/**
 * `--data-dir <dir>` or `--data-dir=<dir>` (the first one given wins), else the environment
 * variable `IGNITION_DATA_DIR`, else null (the caller picks its platform default). An empty value
 * counts as absent. The answer is an absolute path, resolved against the current directory.
 */
export function resolveDataDir(argv: string[], env: Record<string, string | undefined>): string | null {
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg === FLAG) {
      const next = argv[i + 1];
      if (next !== undefined && next !== '' && !next.startsWith('--')) return resolve(next);
    } else if (arg.startsWith(`${FLAG}=`)) {
      const value = arg.slice(FLAG.length + 1);
      if (value !== '') return resolve(value);
    }
  }
  const fromEnv = env['IGNITION_DATA_DIR'];
  if (fromEnv !== undefined && fromEnv.trim() !== '') return resolve(fromEnv);
  return null;
}

/** The store file inside `dataDir`, creating the folder (and its parents) if missing. */
export function storeFileIn(dataDir: string): string {
  mkdirSync(dataDir, { recursive: true });
  return join(dataDir, STORE_FILE_NAME);
}
