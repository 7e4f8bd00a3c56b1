import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { collectReadEvents } from './collect-read-events.js';
import type { LogReadResult } from './log-read-result.js';
import { readGpxEvents } from './read-gpx.js';

const READ_IN = new URL('../../../../fixtures/read/in/', import.meta.url);
const WRITE_OUT = new URL('../../../../fixtures/write/out/', import.meta.url);

function collect(chunks: Iterable<string>): LogReadResult {
  return collectReadEvents(readGpxEvents({ fileName: 'case.gpx', chunks }), {
    fileName: 'case.gpx',
    format: 'gpx',
    timeZone: 'UTC',
  });
}

/**
 * The same text read both ways: given whole (the fast scanner and its point path may take it) and
 * given as a stream of one chunk (always the general XML parser, saxes).
 */
function readBothWays(text: string): { fast: LogReadResult; general: LogReadResult } {
  function* stream(): Generator<string> {
    yield text;
  }
  return { fast: collect([text]), general: collect(stream()) };
}

const fixCount = (r: LogReadResult) => r.tracks.reduce((n, t) => n + t.length, 0);

/** A GPX 1.1 document around the given points (a vehicle track in one segment). */
function track(points: string, eol = '\n'): string {
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    '<gpx version="1.1" creator="Hollowtide Subsea test" xmlns="http://www.topografix.com/GPX/1/1" xmlns:ll="urn:hollowtide:test:1">',
    '  <trk><name>ROV Kittiwake dive 7</name><type>vehicle</type>',
    '    <trkseg>',
    points,
    '    </trkseg>',
    '  </trk>',
    '</gpx>',
    '',
  ].join(eol);
}

/** A point as a logger writes it, with the time `second` seconds after 2026-03-12T15:15:00Z. */
function loggerPoint(second: number, lat = '56.4421369', lon = '-5.6194274'): string {
  const time = new Date(Date.UTC(2026, 2, 12, 15, 15, second)).toISOString();
  const depth = (0.29 + second * 0.21).toFixed(2);
  return (
    `      <trkpt lat="${lat}" lon="${lon}"><ele>-${depth}</ele><time>${time}</time><extensions>` +
    `<ll:depth_m>${depth}</ll:depth_m><ll:heading_deg>${(127 + second * 7.3).toFixed(1)}</ll:heading_deg>` +
    `<ll:slant_range_m>7.02</ll:slant_range_m><ll:bearing_rel_deg>${(37.41 - second * 11).toFixed(2)}</ll:bearing_rel_deg>` +
    '</extensions></trkpt>'
  );
}

const PLAIN = track([0, 1, 2].map((s) => loggerPoint(s)).join('\n'));

/**
 * Documents, or points (each read in a document of its own between two logger points, then all in
 * one), that the point path must read exactly as the general path, or leave to it.
 */
const EDGE_CASES: Record<string, string | string[]> = {
  'logger points': PLAIN,
  'CRLF line ends': track([0, 1, 2].map((s) => loggerPoint(s)).join('\r\n'), '\r\n'),
  'no ele': track(
    '<trkpt lat="1" lon="2"><time>2026-03-12T15:15:00Z</time></trkpt><trkpt lat="1" lon="2"><time>2026-03-12T15:15:01Z</time></trkpt>',
  ),
  'no time (rejected)': track(
    `${loggerPoint(0)}\n<trkpt lat="1" lon="2"><ele>-3</ele></trkpt>\n<trkpt lat="1" lon="2"><ele>-3</ele><time></time></trkpt>`,
  ),
  'white space and newlines between and inside elements': track(
    `<trkpt\n  lat="56.1"\tlon="-5.2" >\n  <ele>\n -3.5 \n</ele>\r\n  <time>\t2026-03-12T15:15:00.250Z </time>\n  <extensions>\n    <ll:depth_m> 3.5</ll:depth_m>\n  </extensions>\n</trkpt>`,
  ),
  'single quotes, lon first': track(
    `<trkpt lon='-5.2' lat='56.1'><time>2026-03-12T15:15:00Z</time></trkpt>${loggerPoint(1)}`,
  ),
  'extensions in other namespaces and without one': [
    '<trkpt lat="56.1" lon="-5.2"><time>2026-03-12T15:15:00Z</time><extensions><ns3:TrackPointExtension><ns3:depth>4.5</ns3:depth><ns3:course>181.5</ns3:course></ns3:TrackPointExtension></extensions></trkpt>',
    '<trkpt lat="56.1" lon="-5.2"><time>2026-03-12T15:15:01Z</time><extensions><xyz:Depth>4.6</xyz:Depth><ship_lat>56.2</ship_lat><vessel_lon>-5.3</vessel_lon><SOG>1.5</SOG><quality>2</quality></extensions></trkpt>',
    '<trkpt lat="56.1" lon="-5.2"><time>2026-03-12T15:15:02Z</time><depth>4.7</depth><hdg>-10</hdg><brg>370</brg><surface_heading>720.5</surface_heading></trkpt>',
    '<trkpt lat="56.1" lon="-5.2"><time>2026-03-12T15:15:03Z</time><extensions><a:ele>-9</a:ele><b:time>2026-03-12T15:15:09Z</b:time></extensions></trkpt>',
  ],
  'surface position out of range': track(
    '<trkpt lat="56.1" lon="-5.2"><time>2026-03-12T15:15:00Z</time><extensions><ll:surface_lat>95</ll:surface_lat><ll:surface_lon>-190</ll:surface_lon></extensions></trkpt>',
  ),
  'comments (whole document to the general path)': track(`<!-- logger v2 -->\n${loggerPoint(0)}\n${loggerPoint(1)}`),
  'CDATA in a value': track(
    `${loggerPoint(0)}\n<trkpt lat="1" lon="2"><ele><![CDATA[-3.5]]></ele><time>2026-03-12T15:15:01Z</time></trkpt>`,
  ),
  'character references': track(
    `${loggerPoint(0)}\n<trkpt lat="&#53;6.1" lon="2"><ele>&#45;3.5</ele><time>2026-03-12T15:15:01Z</time></trkpt>`,
  ),
  'out-of-range and unreadable coordinates (rejected)': [
    loggerPoint(0),
    loggerPoint(1, '91', '2'),
    loggerPoint(2, '-90.0000001', '2'),
    loggerPoint(3, '45', '180.5'),
    loggerPoint(4, '90', '-180'),
    loggerPoint(5, 'abc', '2'),
    loggerPoint(6, '', '2'),
    loggerPoint(7, ' 45', '2'),
    loggerPoint(8, '45N', '2'),
    loggerPoint(9, '59 30.5', '005 12.25 E'),
    loggerPoint(10, '1e1', '2'),
    '<trkpt lon="2"><time>2026-03-12T15:15:11Z</time></trkpt>',
    '<trkpt lat="1" lon="2" src="usbl"><time>2026-03-12T15:15:12Z</time></trkpt>',
  ],
  'numbers the decimal scanner does not read': [
    '1e3',
    '0x10',
    '+5',
    '-0',
    '5.',
    '.5',
    'Infinity',
    'NaN',
    '1,5',
    '12345678901234567890',
    '-',
    '',
    ' ',
  ].map(
    (v, i) =>
      `<trkpt lat="1" lon="2"><ele>${v}</ele><time>2026-03-12T15:15:${String(i).padStart(2, '0')}Z</time></trkpt>`,
  ),
  'times the ISO scanner does or does not read': [
    '2026-03-12T15:15:00Z',
    '2026-03-12T15:15:01.5Z',
    '2026-03-12T15:15:02.123456Z',
    '2026-03-12T15:15:03',
    '2026-03-12T15:15:04+02:00',
    '2026-03-12T15:15:60Z',
    '1970-01-01T00:00:00Z',
    '2026-02-30T00:00:00Z',
    '2026-03-12t15:15:05z',
    '2026-03-12 15:15:06Z',
    'yesterday',
  ].map((t) => `<trkpt lat="1" lon="2"><time>${t}</time></trkpt>`),
  'empty, self-closing and repeated leaves': [
    '<trkpt lat="1" lon="2"><ele></ele><time>2026-03-12T15:15:00Z</time></trkpt>',
    '<trkpt lat="1" lon="2"><ele/><time>2026-03-12T15:15:01Z</time></trkpt>',
    '<trkpt lat="1" lon="2"><ele>-1</ele><ele>-2</ele><time>2026-03-12T15:15:02Z</time></trkpt>',
    '<trkpt lat="1" lon="2"><ele>-1</ele><ele></ele><time>2026-03-12T15:15:03Z</time></trkpt>',
    '<trkpt lat="1" lon="2"><ele>x</ele><ele>-2</ele><time>2026-03-12T15:15:04Z</time></trkpt>',
    '<trkpt lat="1" lon="2"><time>2026-03-12T15:15:05Z</time><time></time></trkpt>',
  ],
  'leaves the point path does not expect': [
    '<trkpt lat="1" lon="2"><ele unit="m">-1</ele><time>2026-03-12T15:15:00Z</time></trkpt>',
    '<trkpt lat="1" lon="2"><name>fix 2</name><desc>Sgeir Dubh – ö</desc><sym>dot</sym><sat>7</sat><fix>3d</fix><time>2026-03-12T15:15:01Z</time></trkpt>',
    '<trkpt lat="1" lon="2"><ele>-1</ele><trkpt>x</trkpt><time>2026-03-12T15:15:02Z</time></trkpt>',
    '<trkpt lat="1" lon="2"><time>2026-03-12T15:15:03Z</time><extensions><ll:group><ll:depth_m>3</ll:depth_m></ll:group></extensions></trkpt>',
    '<trkpt lat="1" lon="2"><time>2026-03-12T15:15:04Z</time><extensions><ll:depth_m>\u00a03.2</ll:depth_m></extensions></trkpt>',
    '<trkpt lat="1" lon="2"><ele>3&gt;2</ele><time>2026-03-12T15:15:05Z</time></trkpt>',
    '<trkpt lat="1" lon="2"><ele>-1</ele ><time>2026-03-12T15:15:06Z</time></trkpt >',
    `<trkpt lat="1" lon="2"><desc>${'long '.repeat(80)}</desc><time>2026-03-12T15:15:07Z</time></trkpt>`,
    '<trkpt lat="1" lon="2">text between<time>2026-03-12T15:15:08Z</time></trkpt>',
    '<trkpt lat="1" lon="2"><extensions><extensions><ll:depth_m>3</ll:depth_m></extensions></extensions><time>2026-03-12T15:15:09Z</time></trkpt>',
    '<trkpt lat="1" lon="2"><time>2026-03-12T15:15:10Z</time><extensions></extensions><extensions><ll:depth_m>4</ll:depth_m></extensions></trkpt>',
  ],
  'point shapes changing from point to point': track(
    Array.from({ length: 12 }, (_, i) =>
      i % 3 === 0
        ? loggerPoint(i)
        : i % 3 === 1
          ? `<trkpt lat="56.${i}" lon="-5.${i}"><time>2026-03-12T15:15:${String(i).padStart(2, '0')}Z</time><extensions><ll:heading_deg>${i}</ll:heading_deg></extensions></trkpt>`
          : `<trkpt lon="-5.${i}" lat="56.${i}"><ele>-${i}</ele><time>2026-03-12T15:15:${String(i).padStart(2, '0')}Z</time></trkpt>`,
    ).join('\n      '),
  ),
  'a lone CR (whole document to the general path)': track(`${loggerPoint(0)}\r${loggerPoint(1)}`),
  'a duplicate attribute (malformed)': track(
    `${loggerPoint(0)}\n<trkpt lat="1" lat="2" lon="3"><time>2026-03-12T15:15:01Z</time></trkpt>`,
  ),
  'an end tag that does not match (malformed)': track(
    `${loggerPoint(0)}\n${loggerPoint(1).replace('</ll:depth_m>', '</ll:depth_n>')}`,
  ),
  'a point in a point': track(
    `<trkpt lat="1" lon="2"><time>2026-03-12T15:15:00Z</time><trkseg><trkpt lat="3" lon="4"><time>2026-03-12T15:15:01Z</time></trkpt></trkseg><ele>-5</ele></trkpt>`,
  ),
  'route points with and without time, prefixed points, waypoints': [
    '<gpx version="1.1" xmlns:g="http://www.topografix.com/GPX/1/1">',
    '<wpt lat="56.1" lon="-5.2"><ele>-3</ele><name>Anchor A</name><desc>clump</desc></wpt>',
    '<rte><name>survey line 3</name><rtept lat="56.1" lon="-5.2"><ele>-3</ele></rtept><rtept lat="56.2" lon="-5.3"><time>2026-03-12T15:15:00Z</time></rtept><rtept lat="56.3" lon="-5.4"/></rte>',
    '<trk><trkseg><g:trkpt lat="56.1" lon="-5.2"><g:time>2026-03-12T15:15:00Z</g:time></g:trkpt></trkseg></trk>',
    '<trkseg><trkpt lat="1" lon="2"><time>2026-03-12T15:15:00Z</time></trkpt></trkseg>',
    '</gpx>',
  ].join('\n'),
};

describe('readGpxEvents', () => {
  it('reads the fixtures the same whether the point path takes their points or the general parser does', () => {
    const texts = [
      ...readdirSync(READ_IN)
        .filter((f) => f.endsWith('.gpx'))
        .map((f) => readFileSync(new URL(f, READ_IN), 'utf8')),
      ...readdirSync(WRITE_OUT)
        .filter((f) => f.endsWith('.gpx'))
        .map((f) => readFileSync(new URL(f, WRITE_OUT), 'utf8')),
    ];
    expect(texts.length).toBeGreaterThanOrEqual(10);
    for (const text of texts) {
      const { fast, general } = readBothWays(text);
      expect(fast).toEqual(general);
    }
  });

  it('reads logger points straight into the columns, with the values the general parser gives', () => {
    const { fast, general } = readBothWays(PLAIN);
    expect(fast).toEqual(general);
    expect(fixCount(fast)).toBe(3);
    const columns = fast.tracks[0]?.columns;
    // depth from the depth extension (positive down), not from ele
    expect(columns?.depthM[2]).toBe(0.71);
    expect(columns?.timeMs[1]).toBe(Date.UTC(2026, 2, 12, 15, 15, 1));
    expect(fast.tracks[0]?.sourceLines[0]).toBe(5);
  });

  for (const [name, edgeCase] of Object.entries(EDGE_CASES)) {
    it(`reads "${name}" the same on both paths`, () => {
      const texts =
        typeof edgeCase === 'string'
          ? [edgeCase]
          : [
              ...edgeCase.map((point) => track([loggerPoint(0), point, loggerPoint(59)].join('\n'))),
              track(edgeCase.join('\n')),
            ];
      for (const text of texts) {
        const { fast, general } = readBothWays(text);
        expect(fast, text).toEqual(general);
        expect(fast.rowCount).toBeGreaterThan(0);
      }
    });
  }

  it('tells the consumer the size of each track up front when it reads the text whole', () => {
    const text = PLAIN.replace(
      '</trk>',
      `</trk>\n<trk><name>surface unit</name><trkseg>\n${loggerPoint(9)}\n</trkseg></trk>`,
    );
    const hints = [...readGpxEvents({ fileName: 'case.gpx', chunks: [text] })].flatMap((e) =>
      e.kind === 'track' ? [e.capacityHint] : [],
    );
    expect(hints).toEqual([3, 1]);
    expect(collect([text]).tracks.map((t) => t.length)).toEqual([3, 1]);
  });

  it('keeps NaN for the points without a value in a column that only some points fill, on both paths', () => {
    // 600 points (batches grow past 256 and 512): a heading on every 250th, a speed on the last only
    const points = Array.from({ length: 600 }, (_, i) => {
      const time = new Date(Date.UTC(2026, 2, 12, 15, 0, i)).toISOString();
      const heading = i % 250 === 249 ? `<ll:heading>${i}</ll:heading>` : '';
      const speed = i === 599 ? '<ll:speed>1.25</ll:speed>' : '';
      return `<trkpt lat="56.1" lon="-5.2"><time>${time}</time><extensions>${heading}${speed}</extensions></trkpt>`;
    });
    const { fast, general } = readBothWays(track(points.join('\n')));
    expect(fast).toEqual(general);
    const columns = fast.tracks[0]?.columns;
    const headings = [...(columns?.headingDeg ?? [])];
    expect(headings.length).toBe(600);
    // heading i, normalised to [0, 360): 249 and 499 - 360 = 139
    expect(headings.flatMap((h, i) => (Number.isNaN(h) ? [] : [[i, h]]))).toEqual([
      [249, 249],
      [499, 139],
    ]);
    expect([...(columns?.speedMps ?? [])].filter((v) => !Number.isNaN(v))).toEqual([1.25]);
    expect(columns?.speedMps[599]).toBe(1.25);
    expect(columns?.depthM.every((v) => Number.isNaN(v))).toBe(true);
  });

  it('reads mutated logger points the same on both paths (seeded random edits)', () => {
    // mulberry32: a small seeded generator, so a failure can be replayed
    let seed = 0x5eed;
    const random = () => {
      seed = (seed + 0x6d2b79f5) | 0;
      let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
      t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
    const alphabet = [
      '<',
      '>',
      '/',
      '"',
      "'",
      '&',
      ' ',
      '\n',
      '\r',
      '\t',
      '-',
      '+',
      '.',
      '0',
      '9',
      'e',
      ':',
      'Z',
      ']',
      'x',
      'é',
    ];
    const base = track([0, 1, 2, 3].map((s) => loggerPoint(s)).join('\n'));
    const pointsStart = base.indexOf('<trkpt');
    const pointsEnd = base.lastIndexOf('</trkpt>') + 8;
    let wellFormedFixes = 0;
    for (let n = 0; n < 400; n++) {
      let text = base;
      const edits = 1 + Math.floor(random() * 3);
      for (let e = 0; e < edits; e++) {
        const at = pointsStart + Math.floor(random() * (pointsEnd - pointsStart));
        const c = alphabet[Math.floor(random() * alphabet.length)] as string;
        const kind = random();
        text =
          kind < 0.4
            ? text.slice(0, at) + c + text.slice(at)
            : kind < 0.7
              ? text.slice(0, at) + text.slice(at + 1)
              : text.slice(0, at) + c + text.slice(at + 1);
      }
      const { fast, general } = readBothWays(text);
      expect(fast, `mutant ${n}`).toEqual(general);
      wellFormedFixes += fixCount(fast);
    }
    // many mutants stay readable, so the comparison covers points the point path reads or declines
    expect(wellFormedFixes).toBeGreaterThan(200);
  });
});
