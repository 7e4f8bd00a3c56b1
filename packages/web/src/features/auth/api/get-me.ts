import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApiError, apiFetch } from '../../../lib/api-client';
import { authKeys } from './keys';

/** An organisation the user belongs to, with their role there (mirrors the server's `CurrentUserSchema`). */
export interface Membership {
  organisationId: string;
  organisationName: string;
  organisationSlug: string;
  role: 'viewer' | 'editor' | 'admin';
}

/** The signed-in user, as `GET /api/v1/me` and `POST /api/v1/session` answer. */
export interface CurrentUser {
  user: { id: string; email: string; displayName: string; createdAt: string };
  memberships: Membership[];
}

/** The signed-in user, or `null` when nobody is signed in (the server answers 401). */
export async function getMe(): Promise<CurrentUser | null> {
  try {
    return await apiFetch<CurrentUser>('/me');
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export function meQueryOptions() {
  return queryOptions({ queryKey: authKeys.me(), queryFn: getMe, staleTime: 60_000 });
}

export function useMe() {
  return useQuery(meQueryOptions());
}
