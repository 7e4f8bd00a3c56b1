import { InvalidArgumentError } from '@leadline/core';
import { ConfigFileError } from './load-config.js';

/** A mistake in how a verb was called (bad option value, missing file): one line to stderr and exit code 2. */
export class UsageProblem extends Error {
  override readonly name = 'UsageProblem';
}

/** Whether an error raised while a verb prepares its run is the caller's to fix (exit 2), not a bug. */
export function isUsageError(error: unknown): error is Error {
  return error instanceof UsageProblem || error instanceof InvalidArgumentError || error instanceof ConfigFileError;
}
