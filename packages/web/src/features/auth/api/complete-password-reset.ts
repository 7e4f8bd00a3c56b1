import { useMutation } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';

/** Sets a new password with the token from a reset link (`POST /api/v1/password-reset/complete`). */
export function completePasswordReset(input: { token: string; password: string }): Promise<void> {
  return apiFetch<void>('/password-reset/complete', {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify(input),
  });
}

export function useCompletePasswordReset() {
  return useMutation({ mutationFn: completePasswordReset });
}
