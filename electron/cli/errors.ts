/**
 * Command-line failures: a plain sentence for the person at the terminal and an exit code.
 * 2 = the input was refused (bad arguments, unreadable or invalid file); 1 = a fault of ours.
 */
export class CliError extends Error {
  constructor(
    message: string,
    readonly exitCode: 1 | 2 = 2,
  ) {
    super(message);
    this.name = 'CliError';
  }
}

/** Several refusals at once, one `path: why` line each. */
export class CliInputError extends CliError {
  constructor(readonly lines: string[]) {
    super(lines.join('\n'), 2);
    this.name = 'CliInputError';
  }
}
