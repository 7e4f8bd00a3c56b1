import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';

const gzipAsync = promisify(gzip);

/**
 * A rendered file kept ready to serve: its UTF-8 bytes exactly as the writer made them, the same
 * bytes gzipped once, and a strong ETag for each (a hash of the bytes sent, so equal tags mean
 * equal bytes).
 */
export interface PreparedFile {
  fileName: string;
  contentType: string;
  crsNote: string | undefined;
  body: Buffer;
  etag: string;
  gzip: Buffer;
  gzipEtag: string;
  /** Bytes held by both bodies (the cache's measure). */
  byteSize: number;
}

function strongEtag(bytes: Buffer): string {
  return `"${createHash('sha256').update(bytes).digest('base64url').slice(0, 32)}"`;
}

/** Encodes, hashes and gzips a rendered file once (the gzip runs on libuv's thread pool, off the event loop). */
export async function prepareFile(file: {
  fileName: string;
  contentType: string;
  crsNote: string | undefined;
  text: string;
}): Promise<PreparedFile> {
  const body = Buffer.from(file.text, 'utf8');
  const zipped = await gzipAsync(body);
  return {
    fileName: file.fileName,
    contentType: file.contentType,
    crsNote: file.crsNote,
    body,
    etag: strongEtag(body),
    gzip: zipped,
    gzipEtag: strongEtag(zipped),
    byteSize: body.byteLength + zipped.byteLength,
  };
}
