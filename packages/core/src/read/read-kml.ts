import { kml } from '@tmcw/togeojson';
import { DOMParser } from '@xmldom/xmldom';
import { collectReadEvents } from './collect-read-events.js';
import { decodeLogText } from './decode-log-text.js';
import type { LogInput, LogReadResult, ReadOptions } from './log-read-result.js';
import { refusedLog } from './read-csv.js';
import { readGeoJsonEvents } from './read-geojson.js';
import { findForbiddenXml } from './refuse-forbidden-xml.js';

/**
 * Reads a KML 2.2 log through @xmldom/xmldom and @tmcw/togeojson: Placemark points become
 * waypoints, LineStrings and gx:Tracks become tracks (gx:Track `when` gives the times), altitude
 * becomes depth by negation. A DOCTYPE is refused before parsing (`forbidden-xml-construct`);
 * XML the parser cannot read is one `malformed-xml` rejection with its line. Other rejections as
 * `readGeoJsonEvents`; KML positions carry no source line (0).
 */
export function readKml(input: LogInput, options: ReadOptions = {}): LogReadResult {
  const decoded = decodeLogText(input.fileName, input.content);
  if (!decoded.ok) return refusedLog('kml', decoded.rejection);
  const forbidden = findForbiddenXml(input.fileName, decoded.text);
  if (forbidden !== undefined) return refusedLog('kml', forbidden);
  let fatal: { line: number; message: string } | undefined;
  const parser = new DOMParser({
    onError: (level, message, context) => {
      if (level === 'warning' || fatal !== undefined) return;
      const line = (context as { locator?: { lineNumber?: number } } | undefined)?.locator?.lineNumber ?? 1;
      fatal = { line, message: String(message).split('\n')[0] ?? '' };
    },
  });
  let doc: ReturnType<DOMParser['parseFromString']> | undefined;
  try {
    doc = parser.parseFromString(decoded.text, 'text/xml');
  } catch (error) {
    fatal ??= { line: 1, message: error instanceof Error ? (error.message.split('\n')[0] ?? '') : String(error) };
  }
  if (fatal !== undefined || doc === undefined) {
    const f = fatal ?? { line: 1, message: 'no document' };
    return refusedLog('kml', {
      file: input.fileName,
      line: f.line,
      code: 'malformed-xml',
      expected: 'well-formed KML (XML)',
      found: f.message,
    });
  }
  const root = doc.documentElement;
  if (root === null || root.localName !== 'kml') {
    return refusedLog('kml', {
      file: input.fileName,
      line: 1,
      code: 'unknown-format',
      expected: 'a <kml> root element',
      found: root === null ? 'no root element' : `<${root.tagName}>`,
    });
  }
  const geojson = kml(doc);
  const result = collectReadEvents(readGeoJsonEvents(input.fileName, geojson, options, 'kml'), {
    fileName: input.fileName,
    format: 'kml',
    timeZone: 'UTC',
  });
  const ns = root.namespaceURI ?? '';
  result.dialect = ns.includes('2.2') ? 'kml-2.2' : ns === '' ? 'kml' : `kml;${ns}`;
  for (const t of result.tracks) t.provenance.dialect = result.dialect;
  return result;
}
