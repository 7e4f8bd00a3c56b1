import { spawnSync } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { validateGpx } from './validate-gpx.js';

const IN = new URL('../../../../fixtures/read/in/', import.meta.url);
const SCHEMAS = new URL('./schemas/', import.meta.url);

describe('validateGpx', () => {
  // Outside reference: the system's libxml2 `xmllint` (/usr/bin/xmllint) against the same published XSDs.
  const cases = readdirSync(IN).filter((f) => f.endsWith('.gpx') && !/billion|external-entity/.test(f));
  for (const file of cases) {
    it(`agrees with /usr/bin/xmllint on ${file}`, async () => {
      const text = readFileSync(new URL(file, IN), 'utf8');
      const ours = await validateGpx(file, text);
      const xsd = fileURLToPath(new URL(`${ours.schema}.xsd`, SCHEMAS));
      const path = fileURLToPath(new URL(file, IN));
      const reference = spawnSync('/usr/bin/xmllint', ['--nonet', '--noout', '--schema', xsd, path], {
        encoding: 'utf8',
      });
      expect(ours.valid).toBe(reference.status === 0);
      const referenceLines = [...reference.stderr.matchAll(/\.gpx:(\d+):/g)].map((m) => Number(m[1]));
      expect([...new Set(ours.messages.map((m) => m.line))].sort()).toEqual([...new Set(referenceLines)].sort());
    });
  }

  it('never fetches: a schemaLocation pointing at the network changes nothing', async () => {
    const gpx =
      '<?xml version="1.0"?><gpx version="1.1" creator="t" xmlns="http://www.topografix.com/GPX/1/1" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance" xsi:schemaLocation="http://www.topografix.com/GPX/1/1 http://example.invalid/gpx.xsd"/>';
    expect(await validateGpx('net.gpx', gpx)).toEqual({ schema: 'gpx-1.1', valid: true, messages: [] });
  });
});
