import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiFetch } from '../../../lib/api-client';
import { authKeys } from './keys';

/** Ends the session (`DELETE /api/v1/session`). */
export function signOut(): Promise<void> {
  return apiFetch<void>('/session', { method: 'DELETE' });
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      queryClient.setQueryData(authKeys.me(), null);
      // Everything cached belonged to the signed-in user.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
    },
  });
}
