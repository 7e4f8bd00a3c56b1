import { type ReadOptions, resolveCrs } from '@leadline/core';
import type { CommonOptions } from './common-options.js';
import type { LeadlineConfig } from './load-config.js';
import { UsageProblem } from './usage-problem.js';

/**
 * The reader options of one run from the common options and the config file: `--as`, `--columns`
 * (a map, or the name of a column map under "columns" in the config file), `--tz` (else the config's
 * default time zone) and `--input-crs`. Checks the zone and the CRS before any file is read, so a typo
 * is one usage error rather than a failure per file.
 */
export function buildReadOptions(
  options: Pick<CommonOptions, 'as' | 'columns' | 'tz' | 'inputCrs'>,
  config: LeadlineConfig,
): ReadOptions {
  const timeZone = options.tz ?? config.defaults?.tz;
  if (timeZone !== undefined && !isKnownTimeZone(timeZone)) {
    throw new UsageProblem(`unknown time zone "${timeZone}" (an IANA name such as Europe/Oslo or Australia/Hobart)`);
  }
  if (options.inputCrs !== undefined) resolveCrs(options.inputCrs);
  const columns = typeof options.columns === 'string' ? namedColumnMap(options.columns, config) : options.columns;
  return {
    ...(options.as === undefined ? {} : { format: options.as as ReadOptions['format'] }),
    ...(columns === undefined ? {} : { columns: columns as ReadOptions['columns'] }),
    ...(timeZone === undefined ? {} : { timeZone }),
    ...(options.inputCrs === undefined ? {} : { inputCrs: options.inputCrs }),
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
