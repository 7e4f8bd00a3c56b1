import { SingleBar } from 'cli-progress';
import type { CliIo } from '../io.js';

/** A progress bar on a terminal; silent when piped, with `--json`, `--quiet` or `--no-progress`. */
export interface Progress {
  update(done: number): void;
  stop(): void;
}

export function startProgress(
  io: CliIo,
  total: number,
  options: { json: boolean; quiet: boolean; progress: boolean },
): Progress {
  if (!io.isTty || options.json || options.quiet || !options.progress || total < 2) {
    return { update: () => {}, stop: () => {} };
  }
  const bar = new SingleBar({
    format: '{bar} {value}/{total} files  {eta_formatted} left',
    hideCursor: true,
    clearOnComplete: true,
    stream: process.stderr,
  });
  bar.start(total, 0);
  return { update: (done) => bar.update(done), stop: () => bar.stop() };
}
