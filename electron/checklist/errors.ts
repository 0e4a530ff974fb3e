/** A sheet input the builder cannot make a sheet from: the field it is about and a plain sentence. */
export class SheetInputError extends Error {
  readonly code = 'INVALID_INPUT' as const;
  constructor(
    readonly field: string,
    message: string,
  ) {
    super(`${field}: ${message}`);
    this.name = 'SheetInputError';
  }
}
