/**
 * The store's own error: a code the bridge can translate and a sentence a restorer understands.
 * The store never imports anything from `electron/`; `electron/ipc/handlers.ts` turns these into
 * the bridge's `AppFailure`.
 */
export type StoreErrorCode = 'NOT_FOUND' | 'IN_USE' | 'INVALID_INPUT' | 'STORE_TOO_NEW' | 'CORRUPT';

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
