import type { ErrorRequestHandler, RequestHandler } from 'express';

/** An error a service raises on purpose; the error middleware maps `code` to an HTTP status. */
export class AppError extends Error {
  override readonly name = 'AppError';
  readonly code: AppErrorCode;
  readonly details: unknown;

  constructor(code: AppErrorCode, message: string, details?: unknown) {
    super(message);
    this.code = code;
    this.details = details;
  }
}

/** The codes services may raise. */
export type AppErrorCode =
  | 'bad-request'
  | 'unauthenticated'
  | 'forbidden'
  | 'not-found'
  | 'conflict'
  | 'payload-too-large'
  | 'unsupported-media-type'
  | 'unprocessable'
  | 'too-many-requests';

const STATUS: Record<AppErrorCode | 'internal', number> = {
  'bad-request': 400,
  unauthenticated: 401,
  forbidden: 403,
  'not-found': 404,
  conflict: 409,
  'payload-too-large': 413,
  'unsupported-media-type': 415,
  unprocessable: 422,
  'too-many-requests': 429,
  internal: 500,
};

/** The one error body the API returns: `{ error: { code, message, details? } }`. */
export interface ErrorBody {
  error: { code: string; message: string; details?: unknown };
}

/** 404 for any API path no router answered. */
export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new AppError('not-found', `No API route for ${req.method} ${req.originalUrl}`));
};

/** Maps every error to the one error body; unexpected errors are logged and hidden. */
export function createErrorHandler(log: (message: string) => void): ErrorRequestHandler {
  return (error: unknown, req, res, _next) => {
    let code: AppErrorCode | 'internal' = 'internal';
    let message = 'Something went wrong on the server; it has been logged.';
    let details: unknown;
    if (error instanceof AppError) {
      code = error.code;
      message = error.message;
      details = error.details;
    } else if (isBodyParserError(error)) {
      code = error.type === 'entity.too.large' ? 'payload-too-large' : 'bad-request';
      message =
        error.type === 'entity.too.large'
          ? 'The request body is too large.'
          : `The request body could not be read: ${error.message}`;
    } else if (isMulterError(error)) {
      code = error.code === 'LIMIT_FILE_SIZE' ? 'payload-too-large' : 'bad-request';
      message =
        error.code === 'LIMIT_FILE_SIZE'
          ? `The file${error.field ? ` in field "${error.field}"` : ''} is larger than the upload limit.`
          : `The upload could not be read: ${error.message}`;
    } else {
      const text = `unexpected error: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`;
      if (req.log) req.log.error({ err: error }, 'unexpected error');
      else log(text);
    }
    const body: ErrorBody = { error: { code, message, ...(details === undefined ? {} : { details }) } };
    res.status(STATUS[code]).json(body);
  };
}

function isMulterError(
  error: unknown,
): error is { name: 'MulterError'; code: string; field?: string; message: string } {
  return error instanceof Error && error.name === 'MulterError';
}

function isBodyParserError(error: unknown): error is { type: string; message: string } {
  return typeof error === 'object' && error !== null && typeof (error as { type?: unknown }).type === 'string';
}
