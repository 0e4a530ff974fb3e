/**
 * How many engines, parts and plans a workshop file holds, read with plain COUNT(*) so it works on
 * any schema version (a backup may be older than the app) without parsing a single row.
 */
import type Database from 'better-sqlite3';

export type RecordCounts = { engines: number; parts: number; plans: number };

export function countRecords(db: Database.Database): RecordCounts {
  const tables = new Set(
    (db.prepare("SELECT name FROM sqlite_schema WHERE type = 'table'").all() as Array<{ name: string }>).map((r) => r.name),
  );
  const count = (table: 'engines' | 'parts' | 'plans'): number =>
    tables.has(table) ? (db.prepare(`SELECT COUNT(*) AS n FROM ${table}`).get() as { n: number }).n : 0;
  return { engines: count('engines'), parts: count('parts'), plans: count('plans') };
}
