import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApiError, apiFetch } from '../../../lib/api-client';
import { mailboxKeys } from './keys';

/** A message the local fake SMTP server received. */
export interface Mail {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

/**
 * Every message of the fake SMTP server, newest first; `null` when the server runs no fake
 * (the route exists only while it does, so the server answers 404).
 */
export async function listMail(): Promise<Mail[] | null> {
  try {
    const body = await apiFetch<{ messages: Mail[] }>('/dev/mailbox');
    return body.messages;
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) return null;
    throw error;
  }
}

export function mailQueryOptions() {
  return queryOptions({ queryKey: mailboxKeys.messages(), queryFn: listMail, staleTime: 0 });
}

export function useMail() {
  return useQuery(mailQueryOptions());
}
