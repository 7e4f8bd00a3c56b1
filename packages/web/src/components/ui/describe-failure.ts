import { ApiError } from '../../lib/api-client';

/** Why a request from a form failed, in words for the person at the form. */
export function describeFailure(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.status === 429) return 'Too many attempts. Wait a minute, then try again.';
    return error.message;
  }
  return 'The server could not be reached. Check the connection and try again.';
}
