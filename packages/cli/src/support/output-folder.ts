import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, realpathSync, writeFileSync } from 'node:fs';
import { mkdir, writeFile } from 'node:fs/promises';
import { dirname, join, parse, relative, resolve } from 'node:path';
import { LEADLINE_VERSION } from '@leadline/core';
import type { InputFile } from './resolve-inputs.js';

/** Raised when writing would overwrite an input, or an output without `--force`. */
export class OutputRefusedError extends Error {
  override readonly name = 'OutputRefusedError';
}

/** One file the run wrote, as the manifest lists it. */
export interface WrittenOutput {
  path: string;
  bytes: number;
  sha256: string;
}

/** The run manifest written beside the outputs as `leadline-run.json`. */
export interface RunManifest {
  leadlineVersion: string;
  verb: string;
  startedAt: string;
  finishedAt: string;
  settings: Record<string, unknown>;
  inputs: Array<{ path: string; bytes: number; sha256: string }>;
  outputs: WrittenOutput[];
}

/** The manifest's file name. */
export const MANIFEST_FILE = 'leadline-run.json';

/** SHA-256 of bytes, as lowercase hex. */
export function sha256Hex(bytes: Uint8Array | string): string {
  return createHash('sha256').update(bytes).digest('hex');
}

/** What the manifest records of one input. */
export interface InputRecord {
  bytes: number;
  sha256: string;
}

/**
 * The rules of one `--out` folder, plain data so a worker thread can write outputs itself: where
 * outputs go, whether existing outputs may be overwritten, and the inputs (real paths) never to touch.
 */
export interface OutputRules {
  root: string;
  force: boolean;
  inputPaths: readonly string[];
}

/** The output path for an input with a new extension (e.g. `.geojson`), mirroring its relative folder. */
export function outputPathFor(root: string, relativePath: string, extension: string, suffix = ''): string {
  const parsed = parse(relativePath);
  return join(root, parsed.dir, `${parsed.name}${suffix}${extension}`);
}

/**
 * Writes one output under `rules` (synchronously: on a worker thread nothing else waits); throws
 * `OutputRefusedError` instead of overwriting an input or, without force, an existing output.
 */
export function writeOutputFile(rules: OutputRules, path: string, content: string | Uint8Array): WrittenOutput {
  const absolute = checkOutputPath(rules, path);
  // Encoded once, then written, measured and hashed as bytes.
  const bytes = typeof content === 'string' ? Buffer.from(content, 'utf8') : content;
  mkdirSync(dirname(absolute), { recursive: true });
  writeFileSync(absolute, bytes);
  return describeOutput(rules.root, absolute, bytes);
}

function checkOutputPath(rules: OutputRules, path: string): string {
  const absolute = resolve(path);
  if (rules.inputPaths.includes(realPathOrSelf(absolute))) {
    throw new OutputRefusedError(`${absolute}: refusing to overwrite an input file; choose another --out folder`);
  }
  if (!rules.force && existsSync(absolute)) {
    throw new OutputRefusedError(`${absolute}: already exists; add --force to overwrite outputs`);
  }
  return absolute;
}

function describeOutput(root: string, absolute: string, content: string | Uint8Array): WrittenOutput {
  const bytes = typeof content === 'string' ? Buffer.byteLength(content) : content.byteLength;
  return { path: relative(root, absolute), bytes, sha256: sha256Hex(content) };
}

/**
 * The `--out` folder of one run: mirrors the inputs' folder structure, never overwrites an input,
 * refuses to overwrite an existing output unless `force`, and writes the run manifest at the end.
 */
export class OutputFolder {
  readonly root: string;
  /** The folder's rules as plain data, for tasks that write their outputs on a worker thread. */
  readonly rules: OutputRules;
  readonly #inputs: RunManifest['inputs'] = [];
  readonly #outputs: WrittenOutput[] = [];
  readonly #startedAt: Date;

  constructor(root: string, options: { force: boolean; inputs: readonly InputFile[]; now?: Date }) {
    this.root = resolve(root);
    const inputPaths = options.inputs.filter((i) => i.path !== '-').map((i) => realPathOrSelf(i.path));
    this.rules = { root: this.root, force: options.force, inputPaths };
    this.#startedAt = options.now ?? new Date();
  }

  /** The output path for an input with a new extension (e.g. `.geojson`), mirroring its relative folder. */
  pathFor(input: InputFile, extension: string, suffix = ''): string {
    return outputPathFor(this.root, input.relativePath, extension, suffix);
  }

  /** Records an input's size and SHA-256 for the manifest (given, or computed from its bytes). */
  recordInput(input: InputFile, record: Uint8Array | InputRecord): void {
    const { bytes, sha256 } =
      record instanceof Uint8Array ? { bytes: record.byteLength, sha256: sha256Hex(record) } : record;
    this.#inputs.push({ path: input.displayName, bytes, sha256 });
  }

  /** Records an output a worker thread wrote under `rules`. */
  recordOutput(written: WrittenOutput): void {
    this.#outputs.push(written);
  }

  /** Writes one output file; throws `OutputRefusedError` instead of overwriting an input or, without force, an output. */
  async write(path: string, content: string | Uint8Array): Promise<WrittenOutput> {
    const absolute = checkOutputPath(this.rules, path);
    await mkdir(dirname(absolute), { recursive: true });
    await writeFile(absolute, content);
    const written = describeOutput(this.root, absolute, content);
    this.#outputs.push(written);
    return written;
  }

  /** Writes `leadline-run.json` listing inputs, outputs and settings; returns its path. */
  async writeManifest(verb: string, settings: Record<string, unknown>, now: Date = new Date()): Promise<string> {
    const manifest: RunManifest = {
      leadlineVersion: LEADLINE_VERSION,
      verb,
      startedAt: this.#startedAt.toISOString(),
      finishedAt: now.toISOString(),
      settings,
      inputs: [...this.#inputs].sort((a, b) => a.path.localeCompare(b.path)),
      outputs: [...this.#outputs].sort((a, b) => a.path.localeCompare(b.path)),
    };
    const path = join(this.root, MANIFEST_FILE);
    await mkdir(this.root, { recursive: true });
    await writeFile(path, `${JSON.stringify(manifest, null, 2)}\n`);
    return path;
  }
}

function realPathOrSelf(path: string): string {
  try {
    return realpathSync(path);
  } catch {
    return resolve(path);
  }
}
