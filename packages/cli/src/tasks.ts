// Every task the worker threads run, by name: one module for the worker bundle to import, and one
// table for the main thread to type `pool.run` against.
import { auditFileTask } from './commands/audit-task.js';
import { convertFileTask } from './commands/convert-task.js';
import { inspectFileTask } from './commands/inspect-task.js';
import { resolveFileTask } from './commands/resolve-task.js';
import { simulateDiveTask } from './commands/simulate-task.js';
import { splitFileTask } from './commands/split-task.js';
import { type FileTaskEnvelope, runFileTask, type TaskFile } from './support/file-task.js';

/** A verb's work on one input's bytes, wrapped so the worker reads the input and writes the outputs. */
function fileTask<P extends { bytes: Uint8Array }, R extends { ok: boolean; files?: TaskFile[] }>(
  work: (payload: P) => R | Promise<R>,
) {
  return (envelope: FileTaskEnvelope<Omit<P, 'bytes'>>) => runFileTask(work, envelope);
}

/** The tasks, by the name `TaskPool.run` takes. */
export const TASKS = {
  auditFile: fileTask(auditFileTask),
  convertFile: fileTask(convertFileTask),
  inspectFile: fileTask(inspectFileTask),
  resolveFile: fileTask(resolveFileTask),
  splitFile: fileTask(splitFileTask),
  simulateDive: simulateDiveTask,
};

export type TaskName = keyof typeof TASKS;
export type TaskPayload<N extends TaskName> = Parameters<(typeof TASKS)[N]>[0];
export type TaskResult<N extends TaskName> = Awaited<ReturnType<(typeof TASKS)[N]>>;
/** The tasks that read one input file (and may write its outputs). */
export type FileTaskName = Exclude<TaskName, 'simulateDive'>;
