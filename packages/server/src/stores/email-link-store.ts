import type { Knex } from 'knex';
import type { Role } from '../services/roles.js';

/** What a link sent by e-mail is for. */
export type EmailLinkKind = 'invitation' | 'password-reset';

/** A single-use link; the secret in it is stored only as its SHA-256. */
export interface EmailLinkRecord {
  id: string;
  kind: EmailLinkKind;
  email: string;
  organisationId: string | null;
  role: Role | null;
  createdBy: string | null;
  expiresAt: Date;
  usedAt: Date | null;
  createdAt: Date;
}

/** Invitation and password-reset links. */
export interface EmailLinkStore {
  create(input: {
    kind: EmailLinkKind;
    secretHash: string;
    email: string;
    organisationId?: string;
    role?: Role;
    createdBy?: string;
    expiresAt: Date;
  }): Promise<EmailLinkRecord>;
  /**
   * Marks the link of this kind and hash used, if it is unused and unexpired at `now`, and returns it;
   * `undefined` otherwise. One statement, so two concurrent uses cannot both succeed.
   */
  consume(kind: EmailLinkKind, secretHash: string, now: Date): Promise<EmailLinkRecord | undefined>;
  /** The link if it is unused and unexpired at `now`, without using it up. */
  findUsable(kind: EmailLinkKind, secretHash: string, now: Date): Promise<EmailLinkRecord | undefined>;
  listPendingInvitations(organisationId: string, now: Date): Promise<EmailLinkRecord[]>;
  /**
   * Makes a pending invitation of the organisation expire at `now`, so its link no longer works, and
   * returns it; `undefined` when there is no such pending invitation (unknown, other organisation, used or expired).
   */
  revokeInvitation(organisationId: string, id: string, now: Date): Promise<EmailLinkRecord | undefined>;
}

interface LinkRow {
  id: string;
  kind: EmailLinkKind;
  email: string;
  organisation_id: string | null;
  role: Role | null;
  created_by: string | null;
  expires_at: Date;
  used_at: Date | null;
  created_at: Date;
}

const COLUMNS = ['id', 'kind', 'email', 'organisation_id', 'role', 'created_by', 'expires_at', 'used_at', 'created_at'];

function toRecord(row: LinkRow): EmailLinkRecord {
  return {
    id: row.id,
    kind: row.kind,
    email: row.email,
    organisationId: row.organisation_id,
    role: row.role,
    createdBy: row.created_by,
    expiresAt: row.expires_at,
    usedAt: row.used_at,
    createdAt: row.created_at,
  };
}

/** The PostgreSQL implementation. */
export function createKnexEmailLinkStore(db: Knex): EmailLinkStore {
  return {
    async create(input) {
      const [row] = await db('email_links')
        .insert({
          kind: input.kind,
          secret_hash: input.secretHash,
          email: input.email,
          organisation_id: input.organisationId ?? null,
          role: input.role ?? null,
          created_by: input.createdBy ?? null,
          expires_at: input.expiresAt,
        })
        .returning<LinkRow[]>(COLUMNS);
      if (row === undefined) throw new Error('the link was not created');
      return toRecord(row);
    },
    async consume(kind, secretHash, now) {
      const [row] = await db('email_links')
        .where({ kind, secret_hash: secretHash })
        .whereNull('used_at')
        .where('expires_at', '>', now)
        .update({ used_at: now })
        .returning<LinkRow[]>(COLUMNS);
      return row === undefined ? undefined : toRecord(row);
    },
    async findUsable(kind, secretHash, now) {
      const row: LinkRow | undefined = await db('email_links')
        .where({ kind, secret_hash: secretHash })
        .whereNull('used_at')
        .where('expires_at', '>', now)
        .first(COLUMNS);
      return row === undefined ? undefined : toRecord(row);
    },
    async listPendingInvitations(organisationId, now) {
      const rows = await db('email_links')
        .where({ kind: 'invitation', organisation_id: organisationId })
        .whereNull('used_at')
        .where('expires_at', '>', now)
        .select(COLUMNS)
        .orderBy('created_at', 'desc');
      return (rows as LinkRow[]).map(toRecord);
    },
    async revokeInvitation(organisationId, id, now) {
      const [row] = await db('email_links')
        .where({ kind: 'invitation', organisation_id: organisationId, id })
        .whereNull('used_at')
        .where('expires_at', '>', now)
        .update({ expires_at: now })
        .returning<LinkRow[]>(COLUMNS);
      return row === undefined ? undefined : toRecord(row);
    },
  };
}
