import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import type { CurrentUser } from './get-me';
import { authKeys } from './keys';

/** What `POST /api/v1/session` takes. */
export interface SignInInput {
  email: string;
  password: string;
}

/** Signs in; the server sets the session cookie and answers with the user. */
export function signIn(input: SignInInput): Promise<CurrentUser> {
  return apiFetch<CurrentUser>('/session', {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify(input),
  });
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
