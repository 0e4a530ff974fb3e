/**
 * Records in and out of the store: the workshop file (JSON, format.ts) and the parts lists (CSV).
 * A file with any problem is refused whole with a StoreError('INVALID_INPUT') whose `fields` list
 * every problem by row and field; nothing is written.
 */
import { StoreError } from '../errors.js';
import type Database from 'better-sqlite3';
import { createRepositories, type Repositories } from '../repositories/index.js';
import { createTickTimes } from '../repositories/tick-times.js';
import type { PartKind } from '../schema.js';
import { partsFromCsv, partsToCsv } from './csv.js';
import { parseWorkshopFile, type WorkshopFile } from './format.js';
import { applyImport, previewImport, type ImportSummary } from './import.js';
import type { Problem } from './problems.js';

export { exportWorkshop, type ExportedWorkshop, type ExportResult } from './export.js';
export { WORKSHOP_FORMAT, WORKSHOP_FORMAT_VERSION, parseWorkshopFile } from './format.js';
export { csvColumns } from './csv-columns.js';
export { partsFromCsv, partsToCsv } from './csv.js';
export type { ImportItem, ImportOutcome, ImportSummary } from './import.js';
export { problemLines, type Problem } from './problems.js';

export const REFUSED_SENTENCE = 'The file was refused as a whole and nothing was written';

/** The problems as a StoreError: `fields` maps each row-and-field to its message(s). */
export function refused(problems: readonly Problem[]): StoreError {
  const fields: Record<string, string> = {};
  for (const p of problems) fields[p.where] = fields[p.where] ? `${fields[p.where]} ${p.message}` : p.message;
  return new StoreError('INVALID_INPUT', `${REFUSED_SENTENCE}: ${problems.length} problem${problems.length === 1 ? '' : 's'} to correct.`, fields);
}

function checkedFile(raw: unknown): WorkshopFile {
  const parsed = parseWorkshopFile(raw);
  if (!parsed.ok) throw refused(parsed.problems);
  return parsed.file;
}

const reposOf = (db: Database.Database): Repositories => createRepositories(db, { onCorruptRow: () => {} });

export function workshopImportPreview(db: Database.Database, raw: unknown): ImportSummary {
  return previewImport(reposOf(db), checkedFile(raw));
}

/** Everything in the file, in one transaction, ticks with their own times. */
export function workshopImport(db: Database.Database, raw: unknown): ImportSummary {
  return applyImport(reposOf(db), checkedFile(raw), createTickTimes(db));
}

function csvFile(kind: PartKind, text: string): WorkshopFile {
  const parsed = partsFromCsv(kind, text);
  if (!parsed.ok) throw refused(parsed.problems);
  return { parts: parsed.parts.map((part, i) => ({ fileId: i + 1, part })), engines: [] };
}

export function partsCsvExport(db: Database.Database, kind: PartKind): { csv: string; count: number } {
  const parts = reposOf(db).parts.list(kind);
  return { csv: partsToCsv(kind, parts), count: parts.length };
}

export function partsCsvPreview(db: Database.Database, kind: PartKind, text: string): ImportSummary {
  return previewImport(reposOf(db), csvFile(kind, text));
}

export function partsCsvImport(db: Database.Database, kind: PartKind, text: string): ImportSummary {
  return applyImport(reposOf(db), csvFile(kind, text));
}
