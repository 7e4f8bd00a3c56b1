import { readdirSync, readFileSync } from 'node:fs';
import { SaxesParser } from 'saxes';
import { describe, expect, it } from 'vitest';
import { PlainPointScanner, scanGpxFast, type XmlElementHandlers } from './scan-gpx-fast.js';

const IN = new URL('../../../../fixtures/read/in/', import.meta.url);

/** Handlers that write down every call the way the reader uses them (text joined up to each tag). */
function recorder(): { handlers: XmlElementHandlers; log: string[] } {
  const log: string[] = [];
  let text = '';
  return {
    log,
    handlers: {
      open: (name, attributes, line) => {
        text = '';
        log.push(`open ${name} ${JSON.stringify(attributes)} line ${line}`);
      },
      text: (t) => {
        text += t;
      },
      close: (name) => {
        log.push(`close ${name} ${JSON.stringify(text)}`);
        text = '';
      },
    },
  };
}

/** The same calls from the general XML parser (saxes, as the GPX reader configures it); `undefined` when it finds an error. */
function withSaxes(text: string): string[] | undefined {
  const { handlers, log } = recorder();
  const parser = new SaxesParser({ xmlns: false, position: true });
  let failed = false;
  parser.on('error', () => {
    failed = true;
  });
  parser.on('opentag', (tag) => handlers.open(tag.name, tag.attributes as Record<string, string>, parser.line, 0));
  parser.on('text', handlers.text);
  parser.on('closetag', (tag) => handlers.close(tag.name));
  parser.write(text);
  if (!failed) parser.close();
  return failed ? undefined : log;
}

const POINT = `<trkpt lat="59.1" lon="5.2"><ele>-3.5</ele><time>2026-06-01T10:00:00Z</time></trkpt>`;

describe('scanGpxFast', () => {
  it('calls the handlers as the general XML parser does, or declines the file', () => {
    const cases = readdirSync(IN)
      .filter((f) => f.endsWith('.gpx'))
      .map((f) => readFileSync(new URL(f, IN), 'utf8'));
    cases.push(
      `<?xml version="1.0" encoding="UTF-8"?>\r\n<gpx version="1.1">\r\n<trk><name>A\r\nB</name><trkseg>\r\n${POINT}\r\n</trkseg></trk></gpx>\r\n`,
      `<gpx version='1.0'><wpt lat = '1' lon='2' /><trk><trkseg>\n<trkpt\n lat="1"\n lon="2"><time>x</time></trkpt></trkseg></trk></gpx>`,
      `<gpx><a:b x:y="1"><c.d-e_f>text > more</c.d-e_f></a:b></gpx>`,
    );
    let scanned = 0;
    for (const text of cases) {
      const { handlers, log } = recorder();
      if (!scanGpxFast(text, handlers)) continue;
      scanned++;
      expect(log).toEqual(withSaxes(text));
    }
    expect(scanned).toBeGreaterThanOrEqual(6);
  });

  it('declines what it does not read itself, malformed XML included', () => {
    for (const text of [
      `<gpx><!-- a comment --><trk/></gpx>`,
      `<gpx><name>a &amp; b</name></gpx>`,
      `<gpx><name><![CDATA[x]]></name></gpx>`,
      `<?xml version="1.0"?><?style x?><gpx/>`,
      `<?xml version="1.1"?><gpx/>`,
      `<!DOCTYPE gpx><gpx/>`,
      `<gpx><trk></gpx>`,
      `<gpx><trk></trkseg></trk></gpx>`,
      `<gpx a="1" a="2"/>`,
      `<gpx a="1"b="2"/>`,
      `<gpx a="x\ty"/>`,
      `<gpx a="<"/>`,
      `<gpx/><gpx/>`,
      `text<gpx/>`,
      `<gpx/>text`,
      `<gpx>\u0001</gpx>`,
      `<gpx>a\rb</gpx>`,
      `<gpx><näme/></gpx>`,
      `<gpx><name>${'x'.repeat(5000)}</name></gpx>`,
      `<gpx>`,
      ``,
    ]) {
      const { handlers } = recorder();
      expect(scanGpxFast(text, handlers), text.slice(0, 40)).toBe(false);
    }
  });
});

/** A point element as saxes sees it: its attributes, start-tag line, and each element's name and trimmed text at its end tag. */
function pointWithSaxes(doc: string): { attributes: Record<string, string>; line: number; leaves: string[] } {
  const parser = new SaxesParser({ xmlns: false, position: true });
  let attributes: Record<string, string> = {};
  let line = 0;
  let text = '';
  let hadChild = false;
  const leaves: string[] = [];
  parser.on('opentag', (tag) => {
    if (tag.name === 'trkpt' || tag.name === 'rtept') {
      attributes = tag.attributes as Record<string, string>;
      line = parser.line;
    }
    text = '';
    hadChild = false;
  });
  parser.on('text', (t) => {
    text += t;
  });
  parser.on('closetag', (tag) => {
    // a leaf: an element with no child element (its text is the last text run)
    if (!hadChild && tag.name !== 'extensions') leaves.push(`${tag.name}=${text.trim()}`);
    text = '';
    hadChild = true;
  });
  parser.write(doc).close();
  return { attributes, line, leaves: leaves.filter((l) => !/^(trkpt|rtept|trkseg|rte|trk|gpx)=/.test(l)) };
}

/** What `PlainPointScanner` found, in the form of `pointWithSaxes`. */
function found(s: string, scanner: PlainPointScanner): { attributes: Record<string, string>; leaves: string[] } {
  const leaves: string[] = [];
  for (let k = 0; k < scanner.leafCount; k++) {
    const text = s.slice(scanner.leafText[2 * k], scanner.leafText[2 * k + 1]);
    leaves.push(`${scanner.leafNames[k]}=${text}`);
  }
  return {
    attributes: {
      lat: s.slice(scanner.latStart, scanner.latEnd),
      lon: s.slice(scanner.lonStart, scanner.lonEnd),
    },
    leaves,
  };
}

const LOGGER_POINT =
  '<trkpt lat="56.4421369" lon="-5.6194274"><ele>-0.29</ele><time>2026-03-12T15:15:00.000Z</time><extensions><ll:depth_m>0.29</ll:depth_m><ll:heading_deg>127.0</ll:heading_deg></extensions></trkpt>';

describe('PlainPointScanner', () => {
  const plain = [
    LOGGER_POINT,
    LOGGER_POINT.replace('56.4421369', '-0.5').replace('-0.29', '12'),
    `<trkpt lon='2' lat='1'>\r\n  <time> 2026-03-12T15:15:00Z\t</time>\n  <extensions>\n <a:b>x</a:b> </extensions>\n</trkpt>`,
    '<trkpt lat="1" lon="2"></trkpt>',
    '<trkpt lat="" lon="2"><ele></ele><ele>3</ele></trkpt>',
    '<trkpt\n lat="1"\n lon="2"><extensions></extensions><extensions><c>1</c></extensions><d>2</d></trkpt>',
  ];

  it('finds what the general XML parser finds in a plain point, whether it parses it or matches the last shape', () => {
    const scanner = new PlainPointScanner();
    // each point twice (the second time matched against the first one's shape), between others
    for (const point of [...plain, ...plain, ...plain.map((p) => p).reverse()]) {
      const s = `<trkseg>\n${point}\n</trkseg>`;
      const lt = s.indexOf('<trkpt');
      const end = scanner.scan(s, lt, 'trkpt');
      expect(end, point).toBe(lt + point.length);
      const saxes = pointWithSaxes(s);
      expect(found(s, scanner), point).toEqual({ attributes: saxes.attributes, leaves: saxes.leaves });
      expect(s.charCodeAt(scanner.tagEnd)).toBe(62); // the start tag's `>`
      expect(s.slice(0, scanner.tagEnd).split('\n').length).toBe(saxes.line);
      expect(scanner.kind).toBe('trkpt');
    }
  });

  it('reads route points as route points only', () => {
    const scanner = new PlainPointScanner();
    const s = '<rtept lat="1" lon="2"><ele>3</ele></rtept>';
    expect(scanner.scan(s, 0, 'trkpt')).toBe(-1);
    expect(scanner.scan(s, 0, 'rtept')).toBe(s.length);
    expect(scanner.kind).toBe('rtept');
    expect(scanner.scan(s.replaceAll('rtept', 'trkpt'), 0, 'rtept')).toBe(-1);
  });

  it('declines points in any other form, also right after reading a plain point of another shape', () => {
    for (const point of [
      '<trkpt lat="1" lon="2"/>',
      '<trkpt lat="1"><time>x</time></trkpt>',
      '<trkpt lat="1" lon="2" lat="3"></trkpt>',
      '<trkpt lat="1" lon="2" hdop="3"></trkpt>',
      '<trkpt lat = "1" lon="2"></trkpt>',
      '<trkpt lat="1"lon="2"></trkpt>',
      '<trkpt lat="1\t" lon="2"></trkpt>',
      '<trkpt lat="1" lon=\'2"></trkpt>',
      '<trkpt lat="1" lon="2"><ele>-1</elf></trkpt>',
      '<trkpt lat="1" lon="2"><ele>-1</ele ></trkpt>',
      '<trkpt lat="1" lon="2"><ele>-1</ele></trkpt >',
      '<trkpt lat="1" lon="2"><ele x="1">-1</ele></trkpt>',
      '<trkpt lat="1" lon="2"><ele/></trkpt>',
      '<trkpt lat="1" lon="2"><ele>1 2</ele></trkpt>',
      '<trkpt lat="1" lon="2"><ele>a&amp;b</ele></trkpt>',
      '<trkpt lat="1" lon="2"><ele>a>b</ele></trkpt>',
      '<trkpt lat="1" lon="2"><ele>a]b</ele></trkpt>',
      '<trkpt lat="1" lon="2"><ele>é</ele></trkpt>',
      '<trkpt lat="1" lon="2"><ele>\u0001</ele></trkpt>',
      '<trkpt lat="1" lon="2"><ele><!-- x -->1</ele></trkpt>',
      '<trkpt lat="1" lon="2"><ele><![CDATA[1]]></ele></trkpt>',
      '<trkpt lat="1" lon="2">x<ele>1</ele></trkpt>',
      '<trkpt lat="1" lon="2"><a><b>1</b></a></trkpt>',
      '<trkpt lat="1" lon="2"><extensions>1</extensions></trkpt>',
      '<trkpt lat="1" lon="2"><x:extensions><b>1</b></x:extensions></trkpt>',
      `<trkpt lat="1" lon="2"><desc>${'x'.repeat(300)}</desc></trkpt>`,
      `<trkpt lat="1" lon="2">${'<s>1</s>'.repeat(17)}</trkpt>`,
      '<trkpt lat="1" lon="2"><ele>1</ele>',
      '<trkptx lat="1" lon="2"></trkptx>',
    ]) {
      const scanner = new PlainPointScanner();
      expect(scanner.scan(point, 0, 'trkpt'), point).toBe(-1);
      expect(scanner.scan(LOGGER_POINT, 0, 'trkpt')).toBe(LOGGER_POINT.length);
      expect(scanner.scan(point, 0, 'trkpt'), `${point} after a plain point`).toBe(-1);
    }
  });
});

describe('scanGpxFast with a point handler', () => {
  it('hands on plain points whole, on the line the general parser gives, and the rest element by element', () => {
    const text = [
      '<?xml version="1.0"?>',
      '<gpx version="1.1">',
      '<trk><trkseg>',
      LOGGER_POINT,
      `  ${LOGGER_POINT}\r`,
      '<trkpt lat="1"\r\n lon="2"><time>t</time></trkpt>',
      '<trkpt lat="1" lon="2" hdop="3"><time>t</time></trkpt>',
      '</trkseg></trk>',
      '<rte><rtept lat="1" lon="2"></rtept></rte>',
      '<wpt lat="1" lon="2"></wpt>',
      '</gpx>',
    ].join('\n');
    const saxesLines: number[] = [];
    const parser = new SaxesParser({ xmlns: false, position: true });
    parser.on('opentag', (tag) => {
      if (tag.name === 'trkpt' || tag.name === 'rtept' || tag.name === 'wpt') saxesLines.push(parser.line);
    });
    parser.write(text).close();
    const { handlers, log } = recorder();
    const pointLines: number[] = [];
    const taken: string[] = [];
    const handlersWithPoints: XmlElementHandlers = {
      ...handlers,
      point: (_text, point, line) => {
        pointLines.push(line);
        // take the first of each kind of point, decline the rest: declined points go element by element
        if (taken.includes(point.kind)) return false;
        taken.push(point.kind);
        return true;
      },
    };
    expect(scanGpxFast(text, handlersWithPoints)).toBe(true);
    // the point with an extra attribute is never offered; the declined ones are offered, then opened
    expect(pointLines).toEqual([saxesLines[0], saxesLines[1], saxesLines[2], saxesLines[4]]);
    const opened = log.filter((l) => /^open (trkpt|rtept|wpt) /.test(l)).map((l) => Number(l.split(' line ')[1]));
    expect(opened).toEqual([saxesLines[1], saxesLines[2], saxesLines[3], saxesLines[5]]);
  });
});
