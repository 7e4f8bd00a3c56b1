import { createHash } from 'node:crypto';
import type { Request } from 'express';
import type multer from 'multer';

/** An uploaded file as the hashing storage leaves it: multer's fields plus the SHA-256 of its bytes. */
export type HashedFile = Express.Multer.File & { sha256?: string };

/**
 * A multer storage engine that hashes each file with SHA-256 while it streams in and keeps its
 * bytes in memory (they go into PostgreSQL whole); the size limit is multer's, enforced mid-stream.
 */
export function createHashingStorage(): multer.StorageEngine {
  return {
    _handleFile(_req: Request, file: Express.Multer.File, callback) {
      const hash = createHash('sha256');
      const chunks: Buffer[] = [];
      let size = 0;
      file.stream.on('data', (chunk: Buffer) => {
        hash.update(chunk);
        chunks.push(chunk);
        size += chunk.length;
      });
      file.stream.once('error', (error: Error) => callback(error));
      file.stream.once('end', () => {
        const info: Partial<HashedFile> = { buffer: Buffer.concat(chunks, size), size, sha256: hash.digest('hex') };
        callback(null, info);
      });
    },
    _removeFile(_req: Request, file: Express.Multer.File, callback) {
      (file as Partial<HashedFile>).buffer = undefined;
      callback(null);
    },
  };
}
