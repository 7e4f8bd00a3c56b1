/** Stable reason codes for input Leadline could not turn into a fix. Codes never change meaning once published. */
export type RejectionCode =
  | 'empty-file'
  | 'binary-content'
  | 'unsupported-encoding'
  | 'unknown-format'
  | 'malformed-xml'
  | 'forbidden-xml-construct'
  | 'schema-invalid'
  | 'line-too-long'
  | 'wrong-field-count'
  | 'missing-value'
  | 'unparsable-number'
  | 'unparsable-coordinate'
  | 'unparsable-time'
  | 'latitude-out-of-range'
  | 'longitude-out-of-range'
  | 'time-out-of-range'
  | 'non-finite-value'
  | 'bad-checksum'
  | 'unsupported-sentence'
  | 'no-date'
  | 'no-fix'
  | 'projection-failed';

/**
 * One piece of input that did not become a fix, said precisely enough to find and fix it:
 * which file, which line (1-based) and column (1-based, when it applies), why, what was
 * expected and what was found.
 */
export interface Rejection {
  file: string;
  line: number;
  column?: number;
  code: RejectionCode;
  expected: string;
  found: string;
}

/** Formats a rejection as one line: `file:line:column: code: expected …, found …`. */
export function formatRejection(rejection: Rejection): string {
  const where = rejection.column === undefined ? `${rejection.line}` : `${rejection.line}:${rejection.column}`;
  return `${rejection.file}:${where}: ${rejection.code}: expected ${rejection.expected}, found ${rejection.found}`;
}
