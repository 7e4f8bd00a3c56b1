import { dirname, isAbsolute, relative, resolve, sep } from 'node:path';
import { type ReadOptions, resolveCrs } from '@leadline/core';
import type { CommonOptions } from './common-options.js';
import type { LeadlineConfig } from './load-config.js';
import { isUsageError, UsageProblem } from './usage-problem.js';

type ReadFlags = Pick<CommonOptions, 'as' | 'columns' | 'tz' | 'inputCrs'>;
/** One folder's read settings in the config file. */
type FolderSettings = NonNullable<LeadlineConfig['folders']>[string];

/** The read options of a run, input by input. */
export interface ReadSettings {
  /** The options for the input at `path`: those of the config file's innermost folder holding it, the flags over them. */
  forInput(path: string): ReadOptions;
  /** What the run manifest records: the options of inputs in no folder, and each folder's. */
  manifest: ReadOptions & { folders?: Record<string, ReadOptions> };
}

/**
 * The read options of every input of a run: `buildReadOptions` for the command line and defaults,
 * and again for each folder of the config file's `folders` (relative to the file). Every folder's
 * zone, CRS and column map is checked before any file is read; a problem names its key.
 */
export function buildReadSettings(options: ReadFlags, loaded: { config: LeadlineConfig; file?: string }): ReadSettings {
  const base = buildReadOptions(options, loaded.config);
  const root = loaded.file === undefined ? process.cwd() : dirname(loaded.file);
  const folders = Object.entries(loaded.config.folders ?? {}).map(([key, settings]) => {
    try {
      return { key, path: resolve(root, key), options: buildReadOptions(options, loaded.config, settings) };
    } catch (error) {
      if (isUsageError(error)) throw new UsageProblem(`folders.${key} in the config file: ${error.message}`);
      throw error;
    }
  });
  // Innermost first, so a site's sub-folder may differ from the site.
  folders.sort((a, b) => b.path.length - a.path.length);
  const inside = (folder: string, path: string) => {
    const rel = relative(folder, path);
    return rel !== '' && rel !== '..' && !rel.startsWith(`..${sep}`) && !isAbsolute(rel);
  };
  return {
    forInput: (path) => (path === '-' ? base : (folders.find((f) => inside(f.path, resolve(path)))?.options ?? base)),
    manifest:
      folders.length === 0 ? base : { ...base, folders: Object.fromEntries(folders.map((f) => [f.key, f.options])) },
  };
}

/**
 * The reader options from the common options and the config file: `--as`, `--columns` (a map, or the
 * name of a column map under "columns" in the config file), `--tz` and `--input-crs`; where a flag is
 * not given, the `folder`'s setting (one entry of the config's `folders`), else the config's default
 * time zone. Checks the zone and the CRS before any file is read, so a typo
 * is one usage error rather than a failure per file.
 */
export function buildReadOptions(options: ReadFlags, config: LeadlineConfig, folder?: FolderSettings): ReadOptions {
  const timeZone = options.tz ?? folder?.tz ?? config.defaults?.tz;
  if (timeZone !== undefined && !isKnownTimeZone(timeZone)) {
    throw new UsageProblem(`unknown time zone "${timeZone}" (an IANA name such as Europe/Oslo or Australia/Hobart)`);
  }
  const inputCrs = options.inputCrs ?? folder?.inputCrs;
  if (inputCrs !== undefined) resolveCrs(inputCrs);
  const columnsGiven = options.columns ?? folder?.columns;
  const columns = typeof columnsGiven === 'string' ? namedColumnMap(columnsGiven, config) : columnsGiven;
  return {
    ...(options.as === undefined ? {} : { format: options.as as ReadOptions['format'] }),
    ...(columns === undefined ? {} : { columns: columns as ReadOptions['columns'] }),
    ...(timeZone === undefined ? {} : { timeZone }),
    ...(inputCrs === undefined ? {} : { inputCrs }),
  };
}

function namedColumnMap(name: string, config: LeadlineConfig): Record<string, string> {
  const map = config.columns?.[name];
  if (map !== undefined) return map;
  const names = Object.keys(config.columns ?? {});
  throw new UsageProblem(
    `--columns ${name}: no column map by that name in the config file${names.length > 0 ? ` (column maps: ${names.join(', ')})` : ''}; or give key=column pairs`,
  );
}

function isKnownTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}
