import { resolve as resolvePath } from 'node:path';
import { EXIT_IO, EXIT_OK, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import type { FileTaskName, TaskPayload, TaskResult } from '../tasks.js';
import type { CommonOptions } from './common-options.js';
import type { TaskSource } from './file-task.js';
import type { WrittenOutput } from './output-folder.js';
import { OutputFolder } from './output-folder.js';
import { printJson } from './print-json.js';
import { startProgress } from './progress.js';
import { readInputBytes } from './read-input.js';
import { type InputFile, resolveInputs } from './resolve-inputs.js';
import { runPool } from './run-pool.js';
import { createTaskPool, type TaskPool } from './task-pool.js';
import { isUsageError } from './usage-problem.js';

/** What a verb's per-file work gets besides the input. */
export interface FileWork {
  /**
   * Runs a file task on this input on the worker threads: the worker reads the input and, with
   * `--out`, writes the files the task asks for; both go into the manifest. Gives back the task's
   * result (texts of written files emptied) and what was written, in the order of `result.files`.
   */
  run<N extends FileTaskName>(
    name: N,
    task: TaskPayload<N>['task'],
  ): Promise<{ result: TaskResult<N>['result']; written: WrittenOutput[] }>;
  /** The `--out` folder, when the verb writes one and `--out` was given. */
  out: OutputFolder | undefined;
  /** The input's position in `inputs`. */
  index: number;
}

/** How one verb runs over its inputs. */
export interface RunFilesSpec<R> {
  /** The verb, for messages (`leadline <verb>: ...`). */
  verb: string;
  args: readonly string[];
  options: CommonOptions;
  io: CliIo;
  cwd: string;
  /** Whether `--out` makes an output folder for this verb (inspect writes none). */
  writesOutputs: boolean;
  /** Checks on the resolved inputs before any is read; a message returned is a usage error (exit 2). */
  checkInputs?: (inputs: readonly InputFile[]) => string | undefined;
  /** The work on one input, on the pool; an exception is turned into `failed` for that input only. */
  work: (input: InputFile, context: FileWork) => Promise<R>;
  /** The report for an input whose work threw, with the error's message. */
  failed: (input: InputFile, message: string, error: unknown) => R;
}

/** What a run over the inputs gives back to its verb. */
export interface FileRun<R> {
  inputs: InputFile[];
  /** Arguments that matched nothing (already said on standard error). */
  problems: string[];
  out: OutputFolder | undefined;
  /** One report per input, in input order. */
  reports: R[];
  /** `EXIT_IO` when an argument matched nothing, else `EXIT_OK`; the verb raises it for failed inputs. */
  exitCode: number;
}

/**
 * The run loop every file verb shares: resolve the inputs (saying each argument that matched
 * nothing), open the `--out` folder, read each input and hand it to `work` with at most `--jobs` at
 * once on worker threads, with a progress bar; a failure of one input becomes its `failed` report
 * and never stops the others. Returns `EXIT_USAGE` when `checkInputs` refuses the inputs.
 */
export async function runFiles<R>(spec: RunFilesSpec<R>): Promise<FileRun<R> | number> {
  const { io, options, verb } = spec;
  const { inputs, problems } = await resolveInputs(spec.args, spec.cwd);
  for (const problem of problems) io.stderr(`leadline ${verb}: ${problem}\n`);
  const refused = spec.checkInputs?.(inputs);
  if (refused !== undefined) {
    io.stderr(`leadline ${verb}: ${refused}\n`);
    return EXIT_USAGE;
  }
  const out =
    spec.writesOutputs && options.out !== undefined
      ? new OutputFolder(resolvePath(spec.cwd, options.out), { force: options.force, inputs })
      : undefined;
  const progress = startProgress(io, inputs.length, options);
  const pool = createTaskPool(Math.min(options.jobs, Math.max(1, inputs.length)));
  let results: Awaited<ReturnType<typeof runPool<InputFile, R>>>;
  try {
    // Two tasks per worker thread in flight (see createTaskPool), so none idles between files.
    results = await runPool(
      inputs,
      2 * options.jobs,
      (input, index) =>
        spec.work(input, { run: (name, task) => dispatchFileTask(pool, out, input, name, task), out, index }),
      (done) => progress.update(done),
    );
  } finally {
    progress.stop();
    await pool.destroy();
  }
  const reports = results.map((result, i) => {
    if (result.ok) return result.value;
    const error = result.error;
    const message = error instanceof Error ? error.message : `unexpected failure: ${String(error)}`;
    return spec.failed(inputs[i] as InputFile, message, error);
  });
  return { inputs, problems, out, reports, exitCode: problems.length > 0 ? EXIT_IO : EXIT_OK };
}

/**
 * Sends one file task for `input` to the pool (standard input is read here, files on the worker)
 * and records the input and the outputs in the manifest; a file that could not be written then
 * fails this input, after the files written before it are recorded.
 */
async function dispatchFileTask<N extends FileTaskName>(
  pool: TaskPool,
  out: OutputFolder | undefined,
  input: InputFile,
  name: N,
  task: TaskPayload<N>['task'],
): Promise<{ result: TaskResult<N>['result']; written: WrittenOutput[] }> {
  const source: TaskSource = input.path === '-' ? { bytes: await readInputBytes(input) } : { path: input.path };
  const target = out === undefined ? undefined : { rules: out.rules, relativePath: input.relativePath };
  const payload = { source, task, ...(target === undefined ? {} : { target }) } as TaskPayload<N>;
  const outcome = (await pool.run(name, payload)) as TaskResult<FileTaskName>;
  out?.recordInput(input, outcome.input);
  for (const written of outcome.written) out?.recordOutput(written);
  if (outcome.writeError !== undefined) throw new Error(outcome.writeError);
  return { result: outcome.result as TaskResult<N>['result'], written: outcome.written };
}

/**
 * Runs a verb's preparation (config, profiles, setups, option checks); a usage error is said once
 * as `leadline <verb>: <message>` and gives `EXIT_USAGE` instead of the prepared value. Anything else
 * is a bug and is thrown on.
 */
export async function prepareRun<T>(
  verb: string,
  io: CliIo,
  prepare: () => Promise<T>,
): Promise<T | typeof NOT_PREPARED> {
  try {
    return await prepare();
  } catch (error) {
    if (isUsageError(error)) {
      io.stderr(`leadline ${verb}: ${error.message}\n`);
      return NOT_PREPARED;
    }
    throw error;
  }
}

/** What `prepareRun` gives back after a usage error (the verb then returns `EXIT_USAGE`). */
export const NOT_PREPARED: unique symbol = Symbol('not prepared');

/** Prints the run's reports: one JSON document with `--json`, else the verb's table unless `--quiet`. */
export function printReports<R>(
  io: CliIo,
  options: Pick<CommonOptions, 'json' | 'quiet'>,
  reports: readonly R[],
  formatTable: (reports: readonly R[]) => string,
): void {
  if (options.json) printJson(io, reports);
  else if (!options.quiet) io.stdout(formatTable(reports));
}
