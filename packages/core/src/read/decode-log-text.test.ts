import { describe, expect, it } from 'vitest';
import { UnreadableInputError } from '../errors.js';
import { decodeLogChunks, decodeLogText } from './decode-log-text.js';

describe('decodeLogText', () => {
  it('strips a UTF-8 BOM and decodes UTF-16 with and without a BOM', () => {
    expect(decodeLogText('a', new Uint8Array([0xef, 0xbb, 0xbf, 0x61, 0x62]))).toMatchObject({
      ok: true,
      text: 'ab',
      hadBom: true,
    });
    expect(decodeLogText('a', new Uint8Array([0xff, 0xfe, 0x61, 0, 0x62, 0]))).toMatchObject({
      text: 'ab',
      encoding: 'utf-16le',
    });
    expect(decodeLogText('a', new Uint8Array([0, 0x61, 0, 0x62, 0, 0x0a, 0, 0x63]))).toMatchObject({
      text: 'ab\nc',
      encoding: 'utf-16be',
    });
  });

  it('refuses empty and binary content with a reason', () => {
    expect(decodeLogText('e', new Uint8Array(0))).toMatchObject({
      ok: false,
      rejection: { code: 'empty-file', line: 1 },
    });
    expect(decodeLogText('b', new Uint8Array([0x47, 0x49, 0x46, 0, 1, 2]))).toMatchObject({
      ok: false,
      rejection: { code: 'binary-content' },
    });
  });
});

describe('decodeLogChunks', () => {
  it('keeps a multi-byte character split across chunks whole', () => {
    const bytes = new TextEncoder().encode('\uFEFFlat;59°07′N\n');
    const chunks = Array.from(bytes, (b) => new Uint8Array([b]));
    expect([...decodeLogChunks('x', chunks)].join('')).toBe('lat;59°07′N\n');
  });

  it('throws for binary content, which a stream cannot reject row by row', () => {
    expect(() => [...decodeLogChunks('x', [new Uint8Array([1, 0, 2, 0, 0, 0, 9])])]).toThrow(UnreadableInputError);
  });
});
