/**
 * The requests of the "Records and backups" screen: backups, the workshop file and the parts
 * lists as CSV. Spread into the one channel map in channels.ts.
 */
import { z } from 'zod';
import { partKind } from '../../db/schema.js';

const counts = z.object({ engines: z.number().int(), parts: z.number().int(), plans: z.number().int() });

export const backupInfo = z.object({
  name: z.string(),
  createdAt: z.string(),
  reason: z.enum(['manual', 'daily', 'before-migration', 'before-restore', 'before-import']),
  sizeBytes: z.number().int(),
  counts: counts.nullable(),
  schemaVersion: z.number().int().nullable(),
  problem: z.string().optional(),
});
export type BackupInfoView = z.infer<typeof backupInfo>;

export const importSummary = z.object({
  added: z.object({ parts: z.number().int(), engines: z.number().int(), plans: z.number().int(), readings: z.number().int(), ticks: z.number().int() }),
  skipped: z.number().int(),
  renamed: z.number().int(),
  items: z.array(
    z.object({
      record: z.enum(['part', 'engine', 'plan']),
      name: z.string(),
      outcome: z.enum(['added', 'skipped', 'renamed']),
      newName: z.string().optional(),
      kind: partKind.optional(),
      engine: z.string().optional(),
    }),
  ),
});
export type ImportSummaryView = z.infer<typeof importSummary>;

/** A file's text as read in the page; the workshop file is JSON text, a parts list CSV text. */
const fileText = z.string({ error: 'Choose a file to read.' }).min(1, 'The file is empty.').max(50_000_000, 'The file is larger than 50 MB.');

export const recordsChannels = {
  /** A backup of the workshop now, through SQLite's online backup API. */
  'backup.create': { request: z.strictObject({}), response: backupInfo },
  /** Every backup, newest first, with its date and counts; and the keeping rule. */
  'backup.list': {
    request: z.strictObject({}),
    response: z.object({ folder: z.string(), keepLast: z.number().int(), keepMonthly: z.boolean(), backups: z.array(backupInfo) }),
  },
  /** Replaces the workshop with a backup from the list, after a copy of the current one; `confirmed` says the user was asked. */
  'backup.restore': {
    request: z.strictObject({ name: z.string().min(1).max(200), confirmed: z.literal(true, { error: 'Ask the user first: restoring replaces the workshop.' }) }),
    response: z.object({ restored: z.string(), safetyBackup: backupInfo }),
  },
  /** The whole workshop as one JSON file (its text) and a file name to save it under. */
  'workshop.export': {
    request: z.strictObject({}),
    response: z.object({
      text: z.string(),
      fileName: z.string(),
      counts: z.object({ parts: z.number().int(), engines: z.number().int(), plans: z.number().int(), readings: z.number().int(), ticks: z.number().int() }),
      unreadable: z.array(z.string()),
    }),
  },
  /** What importing the file would add, skip or rename; writes nothing. A bad file: INVALID_INPUT, every problem in `fields`. */
  'workshop.importPreview': { request: z.strictObject({ text: fileText }), response: importSummary },
  'workshop.import': { request: z.strictObject({ text: fileText }), response: importSummary },
  'parts.csvExport': { request: z.strictObject({ kind: partKind }), response: z.object({ csv: z.string(), fileName: z.string(), count: z.number().int() }) },
  'parts.csvImportPreview': { request: z.strictObject({ kind: partKind, text: fileText }), response: importSummary },
  'parts.csvImport': { request: z.strictObject({ kind: partKind, text: fileText }), response: importSummary },
} as const;
