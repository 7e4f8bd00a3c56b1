import { createHash, randomBytes } from 'node:crypto';
import express from 'express';
import multer from 'multer';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createHashingStorage, type HashedFile } from './hashing-storage.js';

describe('createHashingStorage', () => {
  it('keeps every byte of a multi-chunk upload and hashes exactly those bytes', async () => {
    const app = express();
    const upload = multer({ storage: createHashingStorage(), limits: { fileSize: 4 * 1024 * 1024 } });
    let received: HashedFile | undefined;
    app.post('/', upload.single('file'), (req, res) => {
      received = req.file as HashedFile;
      res.status(204).end();
    });
    // 1.5 MiB arrives in many stream chunks (busboy reads in pieces of at most 64 KiB).
    const bytes = randomBytes(1536 * 1024);
    await request(app).post('/').attach('file', bytes, 'big.bin').expect(204);
    expect(received?.size).toBe(bytes.length);
    expect(Buffer.compare(received?.buffer ?? Buffer.alloc(0), bytes)).toBe(0);
    expect(received?.sha256).toBe(createHash('sha256').update(bytes).digest('hex'));
  });

  it('stops a file over the limit with multer’s LIMIT_FILE_SIZE', async () => {
    const app = express();
    const upload = multer({ storage: createHashingStorage(), limits: { fileSize: 1000 } });
    app.post('/', upload.single('file'), (_req, res) => {
      res.status(204).end();
    });
    app.use((error: { code?: string }, _req: express.Request, res: express.Response, _next: express.NextFunction) => {
      res.status(413).json({ code: error.code });
    });
    const response = await request(app).post('/').attach('file', Buffer.alloc(5000, 1), 'big.bin').expect(413);
    expect(response.body.code).toBe('LIMIT_FILE_SIZE');
  });
});
