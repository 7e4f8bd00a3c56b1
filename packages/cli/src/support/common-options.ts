import { availableParallelism } from 'node:os';
import { type Command, InvalidArgumentError, Option } from 'commander';

/** The options every file-processing verb accepts (the command-line contract). */
export interface CommonOptions {
  out?: string;
  as?: string;
  /** A column map, or the name of one under "columns" in the config file. */
  columns?: Record<string, string> | string;
  tz?: string;
  inputCrs?: string;
  config?: string;
  jobs: number;
  json: boolean;
  quiet: boolean;
  progress: boolean;
  force: boolean;
}

/** Adds the common options to a verb. */
export function addCommonOptions(command: Command): Command {
  return command
    .option('--out <dir>', 'write outputs under this folder, mirroring the inputs; a run manifest goes beside them')
    .addOption(
      new Option('--as <reader>', 'read every input with this reader instead of detecting the format').choices([
        'gpx',
        'csv',
        'nmea',
        'geojson',
        'kml',
      ]),
    )
    .option(
      '--columns <map>',
      'column map for CSV, e.g. "timeMs=Time,latDeg=Lat,lonDeg=Lon,depthM=Depth"',
      parseColumnMap,
    )
    .option('--tz <zone>', 'IANA time zone of local times in the inputs, e.g. Europe/Oslo')
    .option('--input-crs <code>', 'CRS of projected easting/northing input, e.g. EPSG:25832')
    .option('--config <file>', 'configuration file (default: leadline.config.json in the working folder)')
    .option(
      '--jobs <n>',
      'files processed at once (default: the number of cores)',
      parsePositiveInteger,
      availableParallelism(),
    )
    .option('--json', 'print one JSON document on standard output', false)
    .option('--quiet', 'print nothing but errors', false)
    .option('--no-progress', 'no progress bar, even on a terminal')
    .option('--force', 'overwrite existing outputs', false);
}

/** Reads `key=Header,key2=Header 2` into a map, or keeps a bare name (a map in the config file); commander reports a malformed one as a usage error. */
export function parseColumnMap(text: string): Record<string, string> | string {
  if (/^[A-Za-z0-9_.-]+$/.test(text.trim())) return text.trim();
  const map: Record<string, string> = {};
  for (const pair of text.split(',')) {
    const at = pair.indexOf('=');
    if (at <= 0 || at === pair.length - 1)
      throw new InvalidArgumentError(`"${pair}" is not key=column (e.g. latDeg=Latitude)`);
    map[pair.slice(0, at).trim()] = pair.slice(at + 1).trim();
  }
  return map;
}

/** Parses a positive integer option. */
export function parsePositiveInteger(text: string): number {
  const value = Number(text);
  if (!Number.isInteger(value) || value < 1)
    throw new InvalidArgumentError(`expected a positive whole number, got "${text}"`);
  return value;
}
