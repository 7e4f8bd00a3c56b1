import { UnreadableInputError } from '../errors.js';
import type { Rejection } from '../model/rejection.js';

/** The text of a log, or the one rejection that says why it has none. */
export type DecodedLogText =
  | { ok: true; text: string; encoding: 'utf-8' | 'utf-16le' | 'utf-16be'; hadBom: boolean }
  | { ok: false; rejection: Rejection };

const SNIFF_BYTES = 8192;

/**
 * Turns log bytes (or an already decoded string) into text: strips a UTF-8 BOM, decodes UTF-16
 * with or without a BOM, refuses an empty file (`empty-file`) and binary content (`binary-content`,
 * NUL bytes or mostly control characters in the first 8 KiB). Never throws.
 */
export function decodeLogText(fileName: string, content: Uint8Array | string): DecodedLogText {
  if (typeof content === 'string') {
    const hadBom = content.charCodeAt(0) === 0xfeff;
    const text = hadBom ? content.slice(1) : content;
    if (text.trim().length === 0) return { ok: false, rejection: emptyFile(fileName, content.length) };
    const binary = sniffBinaryText(text);
    if (binary !== undefined) return { ok: false, rejection: binaryContent(fileName, binary) };
    return { ok: true, text, encoding: 'utf-8', hadBom };
  }
  const bytes = content;
  if (bytes.length === 0) return { ok: false, rejection: emptyFile(fileName, 0) };
  let encoding: 'utf-8' | 'utf-16le' | 'utf-16be' = 'utf-8';
  let hadBom = false;
  let start = 0;
  if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) {
    hadBom = true;
    start = 3;
  } else if (bytes[0] === 0xff && bytes[1] === 0xfe) {
    encoding = 'utf-16le';
    hadBom = true;
    start = 2;
  } else if (bytes[0] === 0xfe && bytes[1] === 0xff) {
    encoding = 'utf-16be';
    hadBom = true;
    start = 2;
  } else {
    encoding = sniffUtf16WithoutBom(bytes) ?? 'utf-8';
  }
  if (encoding === 'utf-8') {
    const limit = Math.min(bytes.length, start + SNIFF_BYTES);
    let controls = 0;
    for (let i = start; i < limit; i++) {
      const b = bytes[i] as number;
      if (b === 0) return { ok: false, rejection: binaryContent(fileName, `a NUL byte at offset ${i}`) };
      if (b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d && b !== 0x0c) controls++;
    }
    if (limit > start && controls / (limit - start) > 0.1) {
      return {
        ok: false,
        rejection: binaryContent(fileName, `${controls} control bytes in the first ${limit - start}`),
      };
    }
  }
  // `fatal: false` keeps going over invalid sequences (they become U+FFFD) so nothing is lost silently:
  // rows holding them are rejected later as unparsable.
  const text = new TextDecoder(encoding, { fatal: false }).decode(start === 0 ? bytes : bytes.subarray(start));
  if (text.trim().length === 0) return { ok: false, rejection: emptyFile(fileName, bytes.length) };
  if (encoding !== 'utf-8') {
    const binary = sniffBinaryText(text);
    if (binary !== undefined) return { ok: false, rejection: binaryContent(fileName, binary) };
  }
  return { ok: true, text, encoding, hadBom };
}

/** UTF-16 without a BOM shows as every other byte NUL in ASCII-range text. */
function sniffUtf16WithoutBom(bytes: Uint8Array): 'utf-16le' | 'utf-16be' | undefined {
  const limit = Math.min(bytes.length, SNIFF_BYTES) & ~1;
  if (limit < 4) return undefined;
  let evenNul = 0;
  let oddNul = 0;
  for (let i = 0; i < limit; i += 2) {
    if (bytes[i] === 0) evenNul++;
    if (bytes[i + 1] === 0) oddNul++;
  }
  const pairs = limit / 2;
  if (oddNul > pairs * 0.9 && evenNul < pairs * 0.05) return 'utf-16le';
  if (evenNul > pairs * 0.9 && oddNul < pairs * 0.05) return 'utf-16be';
  return undefined;
}

function sniffBinaryText(text: string): string | undefined {
  const limit = Math.min(text.length, SNIFF_BYTES);
  let controls = 0;
  for (let i = 0; i < limit; i++) {
    const c = text.charCodeAt(i);
    if (c === 0) return `a NUL character at offset ${i}`;
    if (c < 0x20 && c !== 0x09 && c !== 0x0a && c !== 0x0d && c !== 0x0c) controls++;
  }
  return limit > 0 && controls / limit > 0.1 ? `${controls} control characters in the first ${limit}` : undefined;
}

function emptyFile(file: string, size: number): Rejection {
  return {
    file,
    line: 1,
    code: 'empty-file',
    expected: 'log content',
    found: size === 0 ? 'an empty file' : `${size} bytes of white space`,
  };
}

function binaryContent(file: string, found: string): Rejection {
  return { file, line: 1, code: 'binary-content', expected: 'a text log (UTF-8 or UTF-16)', found };
}

/**
 * Decodes a log given as byte chunks (a file read piece by piece) into text chunks in bounded
 * memory, for the streaming readers (`readCsvEvents`, `readNmeaEvents`, `readGpxEvents`). Strips a
 * UTF-8 BOM and decodes UTF-16 with a BOM; characters split across chunks are kept whole. Throws
 * `UnreadableInputError` when the first chunk is binary (the streaming readers cannot reject it as a row).
 */
export function* decodeLogChunks(fileName: string, chunks: Iterable<Uint8Array>): Generator<string> {
  let decoder: InstanceType<typeof TextDecoder> | undefined;
  for (const chunk of chunks) {
    if (decoder === undefined) {
      if (chunk.length === 0) continue;
      let start = 0;
      let encoding: 'utf-8' | 'utf-16le' | 'utf-16be' = 'utf-8';
      if (chunk[0] === 0xef && chunk[1] === 0xbb && chunk[2] === 0xbf) start = 3;
      else if (chunk[0] === 0xff && chunk[1] === 0xfe) [encoding, start] = ['utf-16le', 2];
      else if (chunk[0] === 0xfe && chunk[1] === 0xff) [encoding, start] = ['utf-16be', 2];
      else encoding = sniffUtf16WithoutBom(chunk) ?? 'utf-8';
      if (encoding === 'utf-8') {
        const probe = decodeLogText(fileName, chunk.subarray(start, Math.min(chunk.length, start + SNIFF_BYTES)));
        if (!probe.ok && probe.rejection.code === 'binary-content') {
          throw new UnreadableInputError(
            `${fileName}: ${probe.rejection.expected} expected, found ${probe.rejection.found}`,
          );
        }
      }
      decoder = new TextDecoder(encoding, { fatal: false });
      const text = decoder.decode(chunk.subarray(start), { stream: true });
      if (text.length > 0) yield text;
      continue;
    }
    const text = decoder.decode(chunk, { stream: true });
    if (text.length > 0) yield text;
  }
  if (decoder !== undefined) {
    const rest = decoder.decode();
    if (rest.length > 0) yield rest;
  }
}
