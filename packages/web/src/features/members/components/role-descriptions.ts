import type { Role } from '../api/list-members';

/** What each role may do, in a few words. */
export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  viewer: 'viewer: looks and downloads',
  editor: 'editor: also uploads, re-solves and edits',
  admin: 'admin: also invites people, gives roles and revokes tokens',
};
