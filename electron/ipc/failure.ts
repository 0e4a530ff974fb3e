/**
 * The one error type a handler throws on purpose. It carries a code the UI can act on and a
 * sentence a restorer understands; the dispatcher turns it into `{ ok: false, error }`.
 */
import type { AppError, ErrorCode } from './channels.js';

export class AppFailure extends Error {
  readonly code: ErrorCode;
  readonly fields: Record<string, string> | undefined;

  constructor(code: ErrorCode, message: string, fields?: Record<string, string>) {
    super(message);
    this.name = 'AppFailure';
    this.code = code;
    this.fields = fields;
  }

  toAppError(): AppError {
    return this.fields ? { code: this.code, message: this.message, fields: this.fields } : { code: this.code, message: this.message };
  }
}
