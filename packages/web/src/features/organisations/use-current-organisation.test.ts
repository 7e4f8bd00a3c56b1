import { describe, expect, it } from 'vitest';
import type { Membership } from '../auth/api/get-me';
import { chooseMembership } from './use-current-organisation';

const membership = (organisationId: string, role: Membership['role']): Membership => ({
  organisationId,
  organisationName: `Org ${organisationId}`,
  organisationSlug: `org-${organisationId}`,
  role,
});

describe('chooseMembership', () => {
  const memberships = [membership('a', 'viewer'), membership('b', 'admin')];

  it('keeps the remembered organisation while the person still belongs to it', () => {
    expect(chooseMembership(memberships, 'b')?.role).toBe('admin');
  });

  it('falls back to the first membership when the remembered one is gone or absent', () => {
    expect(chooseMembership(memberships, 'gone')?.organisationId).toBe('a');
    expect(chooseMembership(memberships, null)?.organisationId).toBe('a');
  });

  it('is null for someone in no organisation', () => {
    expect(chooseMembership([], 'a')).toBeNull();
  });
});
