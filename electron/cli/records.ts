/**
 * The records commands on a data folder (`--data-dir DIR`): export, import, backup, restore and
 * parts-csv export|import. JSON out (a CSV export prints the CSV); a refused file exits 2 with one
 * `where: why` line per problem and writes nothing. The same store functions the app uses.
 */
import type Database from 'better-sqlite3';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { backupFileFor, backupsDir, createBackup, KEEP_LAST, KEEP_MONTHLY, listBackups, restoreBackup, type BackupInfo } from '../../db/backup.js';
import { StoreError } from '../../db/errors.js';
import { exportWorkshop, partsCsvExport, partsCsvImport, partsCsvPreview, workshopImport, workshopImportPreview } from '../../db/exchange/index.js';
import { storeFileIn, STORE_FILE_NAME } from '../../db/location.js';
import { closeStore, openStore } from '../../db/open.js';
import { partKinds, type PartKind } from '../../db/schema.js';
import { choiceFlag, onlyFlags, switchFlag, type ParsedArgs } from './args.js';
import { CliError, CliInputError } from './errors.js';
import { readJsonFile } from './commands.js';
import { toJson } from './output.js';

function dataDirOf(args: ParsedArgs, mustExist: boolean): string {
  const v = args.flags.get('data-dir');
  if (v === undefined || v === true || v === '') throw new CliError('--data-dir: give the data folder that holds the workshop, for example --data-dir ~/workshop.');
  const dir = resolve(v);
  if (mustExist && !existsSync(resolve(dir, STORE_FILE_NAME))) throw new CliError(`--data-dir: there is no workshop in ${dir} (no ${STORE_FILE_NAME}).`);
  return dir;
}

/** Opens the store, runs `fn`, closes it; the store's refusals become `where: why` lines (exit 2). */
async function withStore<T>(dir: string, fn: (db: Database.Database) => T | Promise<T>): Promise<T> {
  let db: Database.Database;
  try {
    db = openStore(storeFileIn(dir));
  } catch (e) {
    if (e instanceof StoreError) throw new CliError(`--data-dir: ${e.message}`);
    throw e;
  }
  try {
    return await fn(db);
  } catch (e) {
    throw asCliError(e);
  } finally {
    closeStore(db);
  }
}

function asCliError(e: unknown): unknown {
  if (e instanceof StoreError) {
    if (e.fields && Object.keys(e.fields).length > 0) return new CliInputError([e.message, ...Object.entries(e.fields).map(([k, v]) => `${k}: ${v}`)]);
    return new CliError(e.message);
  }
  return e;
}

const view = ({ file, ...info }: BackupInfo) => ({ ...info, file });

function readText(path: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch {
    throw new CliError(`${path}: cannot read the file.`);
  }
}

function oneFile(args: ParsedArgs, what: string, from = 0): string {
  const files = args.positionals.slice(from);
  if (files.length !== 1) throw new CliError(`${args.command}: give the ${what}, one file (got ${files.length}).`);
  return files[0]!;
}

/** `--out FILE` writes there and prints a short JSON note instead. */
function output(args: ParsedArgs, text: string, note: Record<string, unknown>): string {
  const out = args.flags.get('out');
  if (out === undefined) return text;
  if (out === true) throw new CliError('--out: give the file to write.');
  writeFileSync(out, text);
  return toJson({ written: resolve(out), ...note });
}

export async function exportCommand(args: ParsedArgs): Promise<string> {
  onlyFlags(args, ['data-dir', 'out']);
  if (args.positionals.length > 0) throw new CliError(`export: takes no file; use --out FILE to write one.`);
  const dir = dataDirOf(args, true);
  return withStore(dir, (db) => {
    const { workshop, counts, unreadable } = exportWorkshop(db);
    if (unreadable.length > 0) process.stderr.write(`${unreadable.length} unreadable row(s) left out:\n${unreadable.join('\n')}\n`);
    return output(args, `${JSON.stringify(workshop, null, 2)}\n`, { counts, unreadable });
  });
}

export async function importCommand(args: ParsedArgs): Promise<string> {
  onlyFlags(args, ['data-dir', 'preview']);
  const file = oneFile(args, 'workshop file to read');
  const preview = switchFlag(args, 'preview');
  const dir = dataDirOf(args, false);
  const raw = readJsonFile(file);
  return withStore(dir, (db) => toJson({ preview, ...(preview ? workshopImportPreview(db, raw) : workshopImport(db, raw)) }));
}

export async function backupCommand(args: ParsedArgs): Promise<string> {
  onlyFlags(args, ['data-dir', 'list']);
  if (args.positionals.length > 0) throw new CliError('backup: takes no file; backups go to the backups folder inside the data folder.');
  const dir = dataDirOf(args, true);
  if (switchFlag(args, 'list')) return toJson({ folder: backupsDir(dir), keepLast: KEEP_LAST, keepMonthly: KEEP_MONTHLY, backups: listBackups(dir).map(view) });
  return withStore(dir, async (db) => toJson(view(await createBackup(db, dir, 'manual'))));
}

export async function restoreCommand(args: ParsedArgs): Promise<string> {
  onlyFlags(args, ['data-dir', 'yes']);
  const name = oneFile(args, 'backup name (as `backup --list` shows it)');
  const dir = dataDirOf(args, true);
  if (!switchFlag(args, 'yes')) {
    throw new CliError('--yes: restoring replaces the whole workshop with the backup (a backup of the current one is made first); add --yes to go ahead.');
  }
  let file: string;
  try {
    file = backupFileFor(dir, name);
  } catch (e) {
    throw asCliError(e);
  }
  const storeFile = storeFileIn(dir);
  let db = openStore(storeFile);
  try {
    const done = await restoreBackup(
      { db, file: storeFile, close: () => closeStore(db), reopen: () => (db = openStore(storeFile)) },
      dir,
      file,
    );
    return toJson({ restored: done.restored, safetyBackup: view(done.safetyBackup) });
  } catch (e) {
    throw asCliError(e);
  } finally {
    closeStore(db);
  }
}

export async function partsCsvCommand(args: ParsedArgs): Promise<string> {
  onlyFlags(args, ['data-dir', 'kind', 'out', 'preview']);
  const action = args.positionals[0];
  const kind: PartKind = choiceFlag(args, 'kind', partKinds, null);
  if (action === 'export') {
    if (args.positionals.length > 1) throw new CliError('parts-csv export: takes no file; use --out FILE to write one.');
    const dir = dataDirOf(args, true);
    return withStore(dir, (db) => {
      const { csv, count } = partsCsvExport(db, kind);
      return output(args, csv, { kind, count });
    });
  }
  if (action === 'import') {
    const file = oneFile(args, 'CSV file to read', 1);
    const preview = switchFlag(args, 'preview');
    const dir = dataDirOf(args, false);
    const text = readText(file);
    return withStore(dir, (db) => toJson({ preview, ...(preview ? partsCsvPreview(db, kind, text) : partsCsvImport(db, kind, text)) }));
  }
  throw new CliError(`parts-csv: say export or import${action === undefined ? '' : `, not "${action}"`}.`);
}
