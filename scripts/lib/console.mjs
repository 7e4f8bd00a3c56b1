// @ts-check
// One-line messages for the start and test commands: what happened and what to do.

/** @param {string} message */
export function say(message) {
  process.stdout.write(`leadline: ${message}\n`);
}

/** An expected failure: one line, no stack trace. */
export class SetupError extends Error {
  name = 'SetupError';
}

/** Runs `main`; an expected failure prints its one line and exits 1, anything else prints its stack. @param {() => Promise<void>} main */
export async function runMain(main) {
  try {
    await main();
  } catch (error) {
    if (error instanceof SetupError) {
      process.stderr.write(`leadline: ${error.message}\n`);
    } else {
      process.stderr.write(
        `leadline: unexpected failure: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`,
      );
    }
    process.exitCode = 1;
  }
}
