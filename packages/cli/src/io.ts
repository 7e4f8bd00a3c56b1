/** Where a command writes; tests pass in-memory sinks, the binary passes the process streams. */
export interface CliIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Whether standard output is a terminal (progress bars and colour only then). */
  isTty: boolean;
}

/** The process's own streams. */
export function createProcessIo(): CliIo {
  // `leadline … | head` closes the pipe early: that is the reader's choice, not an error.
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(0);
    throw error;
  });
  return {
    stdout: (text) => process.stdout.write(text),
    stderr: (text) => process.stderr.write(text),
    isTty: Boolean(process.stdout.isTTY),
  };
}
