import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';

const gzipAsync = promisify(gzip);

/** One encoding of a file's bytes with its strong ETag (a hash of exactly those bytes). */
export interface EncodedBody {
  body: Buffer;
  etag: string;
}

/**
 * A rendered file kept ready to serve: its UTF-8 bytes exactly as the writer made them with their
 * strong ETag, and the same bytes gzipped, made once on first demand (a zip of many dives never
 * needs them).
 */
export interface PreparedFile extends EncodedBody {
  fileName: string;
  contentType: string;
  crsNote: string | undefined;
  gzipped(): Promise<EncodedBody>;
  /** Bytes the cache counts: the body plus a quarter of it for its gzip (text tracks gzip to about a sixth). */
  byteSize: number;
}

function strongEtag(bytes: Buffer): string {
  return `"${createHash('sha256').update(bytes).digest('base64url').slice(0, 32)}"`;
}

/** Encodes and hashes a rendered file once; its gzip runs later on libuv's thread pool, off the event loop. */
export function prepareFile(file: {
  fileName: string;
  contentType: string;
  crsNote: string | undefined;
  text: string;
}): PreparedFile {
  const body = Buffer.from(file.text, 'utf8');
  let zipped: Promise<EncodedBody> | undefined;
  return {
    fileName: file.fileName,
    contentType: file.contentType,
    crsNote: file.crsNote,
    body,
    etag: strongEtag(body),
    gzipped() {
      zipped ??= gzipAsync(body).then((bytes) => ({ body: bytes, etag: strongEtag(bytes) }));
      return zipped;
    },
    byteSize: body.byteLength + Math.ceil(body.byteLength / 4),
  };
}
