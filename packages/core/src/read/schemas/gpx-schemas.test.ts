import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { GPX_1_0_XSD, GPX_1_1_XSD } from './gpx-schemas.js';

// SHA-256 of the TopoGrafix XSDs as recorded in shared/standards/README.md (and this folder's README).
const SHA256 = {
  'gpx-1.1.xsd': '9e4d1988b862edbe556305b130f8f6f1b29864fefd0dc02d5dab04ccdd1f34d6',
  'gpx-1.0.xsd': '080f9d4bb987f174ae4f78c9c487abe9a12e7a9ff3ca6d5457d45231230336ac',
};

describe('GPX_1_1_XSD and GPX_1_0_XSD', () => {
  it('are the vendored XSD files byte for byte, and those are the published ones', () => {
    for (const [file, text] of [
      ['gpx-1.1.xsd', GPX_1_1_XSD],
      ['gpx-1.0.xsd', GPX_1_0_XSD],
    ] as const) {
      const bytes = readFileSync(new URL(file, import.meta.url));
      expect(createHash('sha256').update(bytes).digest('hex')).toBe(SHA256[file]);
      expect(Buffer.from(text, 'utf8').equals(bytes)).toBe(true);
    }
  });
});
