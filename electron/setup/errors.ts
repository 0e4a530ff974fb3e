/**
 * Errors the adapter raises when stored data cannot make a checkable setup: a code the UI can
 * show and a sentence a restorer understands.
 */
export type SetupErrorCode = 'NOT_FOUND' | 'INVALID_INPUT';

export class SetupAdapterError extends Error {
  constructor(
    readonly code: SetupErrorCode,
    message: string,
  ) {
    super(message);
    this.name = 'SetupAdapterError';
  }
}
