import { useMutation } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';

/** Asks for a reset link (`POST /api/v1/password-reset`); the answer is the same whether the address is known. */
export function requestPasswordReset(input: { email: string }): Promise<void> {
  return apiFetch<void>('/password-reset', {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify(input),
  });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
