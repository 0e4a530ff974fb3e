/**
 * One schema change. Migrations are plain SQL so a test can read them: it refuses a destructive
 * statement (DROP, RENAME, ALTER ... ADD ... NOT NULL without DEFAULT) unless `destructiveBecause`
 * says why the data it touches is safe.
 */
export type Migration = {
  /** 1, 2, 3, ... with no gaps; becomes the file's `PRAGMA user_version` once applied. */
  readonly version: number;
  /** A few words for logs and error messages. */
  readonly name: string;
  /** Run with `db.exec` inside the migration's transaction. */
  readonly sql: string;
  /** Required when `sql` drops, renames or adds a NOT NULL column without a default. */
  readonly destructiveBecause?: string;
  /**
   * Set for a table rebuild (create new, copy, drop old, rename), which SQLite can only do with
   * foreign keys off (sqlite.org/lang_altertable.html, "other kinds of table schema changes").
   * The runner turns them off around this migration and runs `foreign_key_check` before
   * committing, so a rebuild that would orphan a reference is rolled back whole.
   */
  readonly rebuildsTables?: true;
};
