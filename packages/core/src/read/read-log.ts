import type { LogFormat } from '../model/track.js';
import { collectReadEvents } from './collect-read-events.js';
import { decodeLogText } from './decode-log-text.js';
import type { LogInput, LogReadResult, ReadOptions } from './log-read-result.js';
import { type CsvLayout, readCsvEvents, refusedLog } from './read-csv.js';
import { readGeoJson } from './read-geojson.js';
import { readGpxEvents } from './read-gpx.js';
import { readKml } from './read-kml.js';
import { readNmeaEvents } from './read-nmea.js';
import { findForbiddenXml } from './refuse-forbidden-xml.js';
import { validateGpx } from './validate-gpx.js';

export type { ColumnKey, ColumnReportEntry, LogInput, LogReadResult, ReadOptions } from './log-read-result.js';

const SNIFF_CHARS = 16_384;
const NMEA_LINE = /^[^$!]{0,40}[$!][A-Z0-9]{4,6},/;
const EXTENSION_FORMATS: Record<string, LogFormat> = {
  gpx: 'gpx',
  csv: 'csv',
  tsv: 'csv',
  nmea: 'nmea',
  nma: 'nmea',
  '0183': 'nmea',
  geojson: 'geojson',
  json: 'geojson',
  kml: 'kml',
};

/**
 * Detects a log's format from its content (first 16 KiB): `<gpx` or `<kml` roots, a JSON object
 * with a GeoJSON `type`, lines that are NMEA sentences, or delimited text; the file extension
 * only breaks a tie. `undefined` for empty, binary or unrecognisable content.
 */
export function detectFormat(input: LogInput): LogFormat | undefined {
  const head =
    typeof input.content === 'string'
      ? input.content.slice(0, SNIFF_CHARS)
      : (() => {
          const decoded = decodeLogText(input.fileName, input.content.subarray(0, SNIFF_CHARS));
          return decoded.ok ? decoded.text : '';
        })();
  const text = head.replace(/^\uFEFF/, '').trimStart();
  if (text === '') return undefined;
  const extension = /\.([A-Za-z0-9]+)$/.exec(input.fileName)?.[1]?.toLowerCase();
  const byExtension = extension === undefined ? undefined : EXTENSION_FORMATS[extension];
  if (text.startsWith('<')) {
    const root = /<(?:[A-Za-z_][\w.-]*:)?(gpx|kml)[\s>]/i.exec(text);
    if (root !== null) return (root[1] as string).toLowerCase() === 'gpx' ? 'gpx' : 'kml';
    return byExtension === 'gpx' || byExtension === 'kml' ? byExtension : undefined;
  }
  if (text.startsWith('{') || text.startsWith('[')) {
    if (/"type"\s*:\s*"(FeatureCollection|Feature|GeometryCollection|Point|LineString|MultiLineString)"/.test(text))
      return 'geojson';
    if (byExtension === 'geojson') return 'geojson';
    return undefined;
  }
  const lines = text.split(/\r\n|\r|\n/, 40).filter((l) => l.trim() !== '');
  const nmea = lines.filter((l) => NMEA_LINE.test(l.trim())).length;
  if (nmea > 0 && nmea >= lines.length * 0.5) return 'nmea';
  if (lines.some((l) => /[,;\t|]/.test(l))) return 'csv';
  return byExtension;
}

/**
 * Reads any supported log (GPX 1.0/1.1, CSV/TSV, NMEA 0183, GeoJSON, KML) into the track model.
 * The format comes from `options.format` or `detectFormat`. Never throws for bad data: an
 * unreadable log is a result with one whole-file rejection (`empty-file`, `binary-content`,
 * `unknown-format`, `forbidden-xml-construct`, `malformed-xml`). Throws `InvalidArgumentError`
 * only for caller mistakes (unknown time zone, unknown input CRS, a column map naming no column).
 * Schema validation of GPX is asynchronous: see `readLogAndValidate`.
 */
export function readLog(input: LogInput, options: ReadOptions = {}): LogReadResult {
  const decoded = decodeLogText(input.fileName, input.content);
  const format = options.format ?? detectFormat(input);
  if (!decoded.ok) return refusedLog(format ?? 'csv', decoded.rejection);
  if (format === undefined) {
    const first = decoded.text.trimStart().split(/\r?\n/, 1)[0] ?? '';
    return refusedLog('csv', {
      file: input.fileName,
      line: 1,
      code: 'unknown-format',
      expected: 'a GPX, KML, GeoJSON, NMEA 0183 or delimited (CSV/TSV) log',
      found: `"${first.length > 60 ? `${first.slice(0, 57)}...` : first}"`,
    });
  }
  const text = { fileName: input.fileName, chunks: [decoded.text] };
  let result: LogReadResult;
  switch (format) {
    case 'csv': {
      const layout: CsvLayout = { delimiter: ',', decimalComma: false, hasHeader: false };
      result = collectReadEvents(readCsvEvents(text, options, layout), {
        fileName: input.fileName,
        format,
        timeZone: options.timeZone ?? 'UTC',
        columnReport: () => layout.map?.report,
        capacityHint: estimateLineCount(decoded.text),
      });
      break;
    }
    case 'gpx': {
      const forbidden = findForbiddenXml(input.fileName, decoded.text);
      if (forbidden !== undefined) return refusedLog('gpx', forbidden);
      result = collectReadEvents(readGpxEvents(text, options), { fileName: input.fileName, format, timeZone: 'UTC' });
      break;
    }
    case 'nmea':
      result = collectReadEvents(readNmeaEvents(text, options), {
        fileName: input.fileName,
        format,
        timeZone: 'UTC',
        capacityHint: estimateLineCount(decoded.text),
      });
      break;
    case 'geojson':
      result = readGeoJson({ fileName: input.fileName, content: decoded.text }, options);
      break;
    case 'kml':
      result = readKml({ fileName: input.fileName, content: decoded.text }, options);
      break;
  }
  if (decoded.encoding !== 'utf-8') result.notes.unshift(`decoded as ${decoded.encoding.toUpperCase()}`);
  if (options.format === undefined) result.notes.unshift(`format detected from content: ${format}`);
  return result;
}

/** Lines in a text, estimated from the first 64 KiB (sizes the columns once instead of doubling them). */
function estimateLineCount(text: string): number {
  const sample = text.slice(0, 65_536);
  let lines = 0;
  for (let at = sample.indexOf('\n'); at >= 0; at = sample.indexOf('\n', at + 1)) lines++;
  if (lines === 0 || sample.length === text.length) return lines + 1;
  return Math.ceil((text.length / sample.length) * lines * 1.02);
}

/**
 * `readLog`, then for GPX the schema validation (`validateGpx`) against the published XSD of its
 * version, each problem added to `notes` as `schema: line N: message`. Reading stays lenient:
 * schema problems never remove fixes.
 */
export async function readLogAndValidate(input: LogInput, options: ReadOptions = {}): Promise<LogReadResult> {
  const result = readLog(input, options);
  if (
    result.format !== 'gpx' ||
    result.rejections.some(
      (r) => r.code === 'forbidden-xml-construct' || r.code === 'empty-file' || r.code === 'binary-content',
    )
  )
    return result;
  const decoded = decodeLogText(input.fileName, input.content);
  if (!decoded.ok) return result;
  const validation = await validateGpx(input.fileName, decoded.text);
  if (validation.schema !== 'none' && validation.valid)
    result.notes.push(`schema: valid against the published ${validation.schema} XSD`);
  else {
    const shown = validation.messages.slice(0, 50);
    for (const m of shown) result.notes.push(`schema: line ${m.line}: ${m.message}`);
    if (validation.messages.length > shown.length)
      result.notes.push(`schema: ${validation.messages.length - shown.length} more problems not listed`);
  }
  return result;
}
