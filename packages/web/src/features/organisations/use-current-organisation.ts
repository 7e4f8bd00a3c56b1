import { useCallback, useSyncExternalStore } from 'react';
import { type Membership, useMe } from '../auth/api/get-me';

const STORAGE_KEY = 'leadline.organisationId';
const listeners = new Set<() => void>();

function readStoredId(): string | null {
  try {
    return window.localStorage.getItem(STORAGE_KEY);
  } catch {
    return null;
  }
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  window.addEventListener('storage', listener);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', listener);
  };
}

/** Remembers the organisation a person chose (per browser), telling every open component. */
export function storeOrganisationId(organisationId: string): void {
  try {
    window.localStorage.setItem(STORAGE_KEY, organisationId);
  } catch {
    // Private windows may refuse storage; the choice then lasts until the page reloads.
  }
  for (const listener of listeners) listener();
}

/** Picks the remembered organisation when the user still belongs to it, else their first. */
export function chooseMembership(memberships: readonly Membership[], storedId: string | null): Membership | null {
  return memberships.find((m) => m.organisationId === storedId) ?? memberships[0] ?? null;
}

/**
 * The organisation the signed-in person is working in, with their role there, and a way to switch.
 * `membership` is null while signing in is being checked, when nobody is signed in, or when the
 * person belongs to no organisation.
 */
export function useCurrentOrganisation(): {
  membership: Membership | null;
  memberships: Membership[];
  isPending: boolean;
  switchTo: (organisationId: string) => void;
} {
  const me = useMe();
  const storedId = useSyncExternalStore(subscribe, readStoredId, () => null);
  const memberships = me.data?.memberships ?? [];
  const switchTo = useCallback((organisationId: string) => storeOrganisationId(organisationId), []);
  return { membership: chooseMembership(memberships, storedId), memberships, isPending: me.isPending, switchTo };
}
