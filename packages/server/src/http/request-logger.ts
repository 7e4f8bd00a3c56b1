import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import pino, { type Logger } from 'pino';
import { pinoHttp } from 'pino-http';

/** The server's structured logger: JSON lines; secrets (credentials, cookies, passwords, tokens) are redacted. */
export function createLogger(level: string): Logger {
  return pino({
    level,
    base: { service: 'leadline' },
    redact: {
      paths: [
        'req.headers.authorization',
        'req.headers.cookie',
        'res.headers["set-cookie"]',
        '*.password',
        '*.token',
        '*.secret',
      ],
      censor: '[redacted]',
    },
  });
}

const REQUEST_ID = /^[A-Za-z0-9._-]{1,64}$/;

/** One log line per request with a request id (the caller's `X-Request-Id` if sane, else a new one), echoed back. */
export function createRequestLogger(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId(req: IncomingMessage, res: ServerResponse) {
      const incoming = req.headers['x-request-id'];
      const id = typeof incoming === 'string' && REQUEST_ID.test(incoming) ? incoming : randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    serializers: {
      // The query string may carry a reset or invitation token: log the path only.
      req: (req: { id: unknown; method: string; url: string }) => ({
        id: req.id,
        method: req.method,
        path: req.url.split('?')[0],
      }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
    customLogLevel(_req, res, error) {
      if (error || res.statusCode >= 500) return 'error';
      if (res.statusCode >= 400) return 'warn';
      return 'info';
    },
  });
}
