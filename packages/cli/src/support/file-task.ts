import { readFileSync } from 'node:fs';
import {
  type InputRecord,
  type OutputRules,
  outputPathFor,
  sha256Hex,
  type WrittenOutput,
  writeOutputFile,
} from './output-folder.js';

/** Where a file task finds its input: a path it reads itself, or bytes already read (standard input). */
export type TaskSource = { path: string } | { bytes: Uint8Array };

/** One file a task wants written beside its input's mirror: `<input name><suffix><extension>`. */
export interface TaskFile {
  suffix: string;
  extension: string;
  /** The file's text, or its UTF-8 bytes as a writer built them. */
  content: string | Uint8Array;
}

/** Where a file task writes its files: the `--out` folder's rules and the input's path relative to its root. */
export interface TaskTarget {
  rules: OutputRules;
  relativePath: string;
}

/** What the pool sends for one input: where to read it, where to write, and the verb's own settings. */
export interface FileTaskEnvelope<P> {
  source: TaskSource;
  target?: TaskTarget;
  task: P;
}

/** What a file task gives back: the input's manifest record, the verb's result, and the files written. */
export interface FileTaskOutcome<R> {
  input: InputRecord;
  /** The verb's result; with a target, the contents of its written files are emptied (they are on disk). */
  result: R;
  /** One entry per file of `result.files`, in order, when the task had a target and succeeded. */
  written: WrittenOutput[];
  /** Why a file could not be written (an output already there, an input in the way, a full disk); those before it were. */
  writeError?: string;
}

/**
 * Runs a verb's pure work on one input where the pool put it (a worker thread under `--jobs`): reads
 * the input and takes its SHA-256, runs `work`, and with a target writes the files the work asks for.
 * Only small reports cross back to the main thread, never the input's bytes or an output's text.
 */
export async function runFileTask<P extends { bytes: Uint8Array }, R extends { ok: boolean; files?: TaskFile[] }>(
  work: (payload: P) => R | Promise<R>,
  envelope: FileTaskEnvelope<Omit<P, 'bytes'>>,
): Promise<FileTaskOutcome<R>> {
  const { source, target } = envelope;
  const bytes: Uint8Array = 'path' in source ? readFileSync(source.path) : source.bytes;
  const input = { bytes: bytes.byteLength, sha256: sha256Hex(bytes) };
  const result = await work({ ...envelope.task, bytes } as P);
  const written: WrittenOutput[] = [];
  if (target !== undefined && result.ok)
    try {
      for (const file of result.files ?? []) {
        const path = outputPathFor(target.rules.root, target.relativePath, file.extension, file.suffix);
        written.push(writeOutputFile(target.rules, path, file.content));
        file.content = '';
      }
    } catch (error) {
      // The files written so far stay on disk, so the manifest must still list them.
      return { input, result, written, writeError: error instanceof Error ? error.message : String(error) };
    }
  return { input, result, written };
}
