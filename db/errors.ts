/**
 * The store's own error: a code the bridge can translate and a sentence a restorer understands.
 * The store never imports anything from `electron/`; `electron/ipc/handlers.ts` turns these into
 * the bridge's `AppFailure`.
 */
export type StoreErrorCode =
  | 'NOT_FOUND'
  | 'IN_USE'
  | 'INVALID_INPUT'
  | 'STORE_TOO_NEW'
  | 'CORRUPT'
  /** The record changed (or was replaced) since the screen read it: nothing was written; reload. */
  | 'STALE'
  /** The file is another program's database (tables but no workshop version): refused, unchanged. */
  | 'FOREIGN_FILE'
  /** Another copy of the app (or a browser host) holds the data folder. */
  | 'LOCKED';

export class StoreError extends Error {
  readonly code: StoreErrorCode;
  /** For INVALID_INPUT: `{ "existing.coilPartId": "message" }`, keyed like `fieldMessages` in schema.ts. */
  readonly fields: Record<string, string> | undefined;

  constructor(code: StoreErrorCode, message: string, fields?: Record<string, string>) {
    super(message);
    this.name = 'StoreError';
    this.code = code;
    this.fields = fields;
  }
}

export function isStoreError(err: unknown): err is StoreError {
  return err instanceof StoreError;
}
