import {
  InvalidArgumentError as CoreInvalidArgumentError,
  type CrsListing,
  findCrsAt,
  parseCrsCode,
  resolveCrs,
  searchCrs,
} from '@leadline/core';
import { EXIT_OK, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { parsePositiveInteger, printJson } from '../support/index.js';
import type { RegisterCommand } from './index.js';

/** The options of `leadline crs`. */
export interface CrsOptions {
  /** `lat,lon` in WGS 84 degrees: list the CRSs whose area of use covers it. */
  at?: string;
  limit: number;
  json: boolean;
}

/** One CRS as `--json` prints it. */
export interface CrsReportEntry extends CrsListing {
  /** For a single code looked up: how Leadline converts it (proj4, supplied grid, Helmert fallback). */
  method?: string;
  note?: string;
  proj4?: string;
}

const EXAMPLES = `
Examples:
  leadline crs etrs89 utm 32
  leadline crs british national grid
  leadline crs EPSG:27700
  leadline crs --at 59.04,5.22 --limit 10
  leadline crs --at -17.5,179.99 --json

With words: geographic and projected CRSs whose name holds every word (a number also matches the
code), best match first. With one EPSG code: that CRS, how Leadline converts it and its accuracy.
With --at: the CRSs whose EPSG area of use covers the point, projected first, then the most
accurate datum step to WGS 84, then the smallest area. --json prints an array of objects: code,
name, kind, areaOfUse (west, south, east, north, description), accuracyM, and for a single code
also method, note and proj4.`;

/** Registers `leadline crs`. */
export const registerCrs: RegisterCommand = (program, context) => {
  program
    .command('crs')
    .description('find a coordinate reference system by name words, by code, or by position')
    .argument('[words...]', 'name words or an EPSG code')
    .option('--at <lat,lon>', 'list the CRSs whose area of use covers this WGS 84 position')
    .option('--limit <n>', 'at most this many results', parsePositiveInteger, 20)
    .option('--json', 'print one JSON document on standard output', false)
    .addHelpText('after', EXAMPLES)
    .action((words: string[], options: CrsOptions) => {
      context.exitCode = runCrs(words, options, context.io);
    });
};

/**
 * Runs `leadline crs` and returns the exit code: 0 with results or none found (the message says
 * so), 2 for a usage problem (neither words nor --at, both, a malformed --at, an unusable code).
 */
export function runCrs(words: readonly string[], options: CrsOptions, io: CliIo): number {
  if ((words.length === 0) === (options.at === undefined)) {
    io.stderr(
      'leadline crs: give name words or a code, or --at <lat,lon> (not both); e.g. leadline crs etrs89 utm 32\n',
    );
    return EXIT_USAGE;
  }
  let entries: CrsReportEntry[];
  if (options.at !== undefined) {
    const match = /^\s*(-?\d+(?:\.\d+)?)\s*,\s*(-?\d+(?:\.\d+)?)\s*$/.exec(options.at);
    const lat = Number(match?.[1]);
    const lon = Number(match?.[2]);
    if (!match || Math.abs(lat) > 90 || Math.abs(lon) > 180) {
      io.stderr(`leadline crs: --at "${options.at}": expected lat,lon in decimal degrees, e.g. --at 59.04,5.22\n`);
      return EXIT_USAGE;
    }
    entries = findCrsAt(lat, lon, options.limit);
  } else if (words.length === 1 && /^epsg:/i.test(words[0] ?? '') && parseCrsCode(words[0] ?? '') !== undefined) {
    try {
      const crs = resolveCrs(words[0] ?? '');
      entries = [
        {
          code: crs.code,
          name: crs.name,
          kind: crs.kind,
          areaOfUse: crs.areaOfUse,
          accuracyM: crs.accuracyM,
          method: crs.method,
          note: crs.note,
          proj4: crs.proj4,
        },
      ];
    } catch (error) {
      if (!(error instanceof CoreInvalidArgumentError)) throw error;
      io.stderr(`leadline crs: ${error.message}\n`);
      return EXIT_USAGE;
    }
  } else entries = searchCrs(words, options.limit);

  if (options.json) printJson(io, entries);
  else if (entries.length === 0) io.stderr('leadline crs: nothing found\n');
  else io.stdout(formatTable(entries));
  return EXIT_OK;
}

function formatTable(entries: readonly CrsReportEntry[]): string {
  const lines = ['code\tkind\taccuracy\tname\tarea of use'];
  for (const e of entries) {
    const box = e.areaOfUse;
    const area = box ? `${box.west}..${box.east}°E ${box.south}..${box.north}°N` : '-';
    const accuracy = e.accuracyM === undefined ? '?' : e.accuracyM === 0 ? 'WGS 84' : `${e.accuracyM} m`;
    lines.push([e.code, e.kind, accuracy, e.name, area].join('\t'));
    if (e.note !== undefined) lines.push(`  ${e.note}`, `  ${e.proj4 ?? ''}`);
  }
  return `${lines.join('\n')}\n`;
}
