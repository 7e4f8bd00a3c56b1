/** Base class of every error Leadline's core throws. Problems in the data are values (`Rejection`, `Finding`), not errors. */
export class LeadlineError extends Error {
  override readonly name: string = 'LeadlineError';
  /** A stable, machine-readable code. */
  readonly code: string;

  constructor(code: string, message: string, options?: ErrorOptions) {
    super(message, options);
    this.code = code;
  }
}

/** The caller passed an option or argument that cannot be used (a programming or configuration mistake). */
export class InvalidArgumentError extends LeadlineError {
  override readonly name = 'InvalidArgumentError';

  constructor(message: string, options?: ErrorOptions) {
    super('invalid-argument', message, options);
  }
}

/** The input is too broken to read at all (as opposed to a bad row, which becomes a `Rejection`). */
export class UnreadableInputError extends LeadlineError {
  override readonly name = 'UnreadableInputError';

  constructor(message: string, options?: ErrorOptions) {
    super('unreadable-input', message, options);
  }
}
