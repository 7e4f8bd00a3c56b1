import { stat } from 'node:fs/promises';
import { isAbsolute, relative, resolve } from 'node:path';
import { glob, isDynamicPattern } from 'tinyglobby';

/** One input a verb will process. */
export interface InputFile {
  /** Absolute path, or `-` for standard input. */
  path: string;
  /** How messages name it: relative to the working folder where possible. */
  displayName: string;
  /** Path relative to the folder or glob root it was found under; `--out` mirrors this. */
  relativePath: string;
}

/** What expanding the command-line inputs found. */
export interface ResolvedInputs {
  inputs: InputFile[];
  /** Arguments that matched nothing, each with a one-line reason. */
  problems: string[];
}

const SKIPPED_FOLDERS = ['**/node_modules/**', '**/.git/**', '**/.*/**'];
// Inside a folder, Leadline's own files beside logs are not logs: run manifests, the simulator's
// truth files and configuration files. Named explicitly, they are still read.
const SKIPPED_IN_FOLDERS = [...SKIPPED_FOLDERS, '**/leadline-run.json', '**/*.truth.json', '**/leadline.config.json'];

/**
 * Expands files, folders (recursed, hidden folders skipped) and globs into a sorted, de-duplicated
 * list; `-` stands for standard input. Nothing matched is a problem, not an exception.
 */
export async function resolveInputs(args: readonly string[], cwd: string = process.cwd()): Promise<ResolvedInputs> {
  const inputs: InputFile[] = [];
  const problems: string[] = [];
  const seen = new Set<string>();
  const add = (path: string, root: string) => {
    if (seen.has(path)) return;
    seen.add(path);
    inputs.push({ path, displayName: displayNameOf(path, cwd), relativePath: relative(root, path) });
  };

  for (const arg of args) {
    if (arg === '-') {
      if (!seen.has('-')) inputs.push({ path: '-', displayName: '<stdin>', relativePath: 'stdin' });
      seen.add('-');
      continue;
    }
    const absolute = isAbsolute(arg) ? arg : resolve(cwd, arg);
    const info = await stat(absolute).catch(() => undefined);
    if (info?.isFile()) {
      add(absolute, resolve(absolute, '..'));
    } else if (info?.isDirectory()) {
      const found = await glob('**/*', {
        cwd: absolute,
        absolute: true,
        onlyFiles: true,
        ignore: SKIPPED_IN_FOLDERS,
        dot: false,
      });
      if (found.length === 0) problems.push(`${arg}: the folder holds no files`);
      for (const path of found.sort()) add(path, absolute);
    } else if (isDynamicPattern(arg)) {
      const found = await glob(arg, { cwd, absolute: true, onlyFiles: true, ignore: SKIPPED_FOLDERS });
      if (found.length === 0) problems.push(`${arg}: the pattern matches no file`);
      const root = resolve(cwd, staticPrefix(arg));
      for (const path of found.sort()) add(path, root);
    } else {
      problems.push(`${arg}: no such file or folder`);
    }
  }
  return { inputs, problems };
}

function displayNameOf(path: string, cwd: string): string {
  const rel = relative(cwd, path);
  return rel.startsWith('..') || isAbsolute(rel) ? path : rel;
}

// The folder part of a glob before its first wildcard, so `logs/**/*.csv` mirrors from `logs/` (and
// `/data/**/*.csv` from `/data`: the leading slash of an absolute pattern is kept).
function staticPrefix(pattern: string): string {
  const parts = pattern.split('/');
  const fixed: string[] = [];
  for (const part of parts) {
    if (isDynamicPattern(part)) break;
    fixed.push(part);
  }
  if (fixed.length === parts.length) fixed.pop();
  const prefix = fixed.join('/');
  return prefix === '' ? (pattern.startsWith('/') ? '/' : '.') : prefix;
}
