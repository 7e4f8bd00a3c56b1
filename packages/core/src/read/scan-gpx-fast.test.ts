import { readdirSync, readFileSync } from 'node:fs';
import { SaxesParser } from 'saxes';
import { describe, expect, it } from 'vitest';
import { scanGpxFast, type XmlElementHandlers } from './scan-gpx-fast.js';

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
