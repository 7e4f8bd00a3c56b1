/** A mistake in how a verb was called (bad option value, missing file): one line to stderr and exit code 2. */
export class UsageProblem extends Error {
  override readonly name = 'UsageProblem';
}
