/** The server's one error body. */
export interface ApiErrorBody {
  error: { code: string; message: string; details?: unknown };
}

/** A failed API call, carrying the HTTP status and the server's error body. */
export class ApiError extends Error {
  override readonly name = 'ApiError';
  readonly status: number;
  readonly code: string;
  readonly details: unknown;

  constructor(status: number, body: ApiErrorBody['error']) {
    super(body.message);
    this.status = status;
    this.code = body.code;
    this.details = body.details;
  }
}

const API_BASE = '/api/v1';

/** Calls the API and returns its JSON; throws `ApiError` with the server's error body on failure. */
export async function apiFetch<T>(path: string, init: RequestInit = {}): Promise<T> {
  const response = await fetch(`${API_BASE}${path}`, {
    ...init,
    credentials: 'same-origin',
    headers: { Accept: 'application/json', ...init.headers },
  });
  const text = await response.text();
  const body: unknown = text === '' ? undefined : JSON.parse(text);
  if (!response.ok && !isHealthShape(response.status, body)) {
    const error = (body as Partial<ApiErrorBody> | undefined)?.error;
    throw new ApiError(
      response.status,
      error ?? { code: 'http-error', message: `The server answered ${response.status}.` },
    );
  }
  return body as T;
}

// The health route answers 503 with a full report while the database is down; that report is data, not an error.
function isHealthShape(status: number, body: unknown): boolean {
  return status === 503 && typeof body === 'object' && body !== null && 'database' in body;
}
