import type { Knex } from 'knex';
import type { Role } from '../services/roles.js';

/** Read or read and write; a read token never changes anything. */
export type TokenScope = 'read' | 'read-write';

/** An API token's record; the secret itself is never stored, only its SHA-256. */
export interface ApiTokenRecord {
  id: string;
  organisationId: string;
  userId: string;
  name: string;
  displayPrefix: string;
  scope: TokenScope;
  expiresAt: Date | null;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
  createdAt: Date;
}

/** API tokens by organisation and user. */
export interface ApiTokenStore {
  create(input: {
    organisationId: string;
    userId: string;
    name: string;
    displayPrefix: string;
    secretHash: string;
    scope: TokenScope;
    expiresAt: Date | null;
  }): Promise<ApiTokenRecord>;
  /** A token by its secret's hash, with its user's current role in its organisation (`undefined` once they left). */
  findBySecretHash(secretHash: string): Promise<(ApiTokenRecord & { memberRole: Role | undefined }) | undefined>;
  findById(organisationId: string, id: string): Promise<ApiTokenRecord | undefined>;
  /** Tokens of an organisation, of one user when `userId` is given; newest first. */
  list(organisationId: string, userId?: string): Promise<ApiTokenRecord[]>;
  markUsed(id: string, at: Date): Promise<void>;
  revoke(id: string, at: Date): Promise<void>;
}

interface TokenRow {
  id: string;
  organisation_id: string;
  user_id: string;
  name: string;
  display_prefix: string;
  scope: TokenScope;
  expires_at: Date | null;
  last_used_at: Date | null;
  revoked_at: Date | null;
  created_at: Date;
}

function toRecord(row: TokenRow): ApiTokenRecord {
  return {
    id: row.id,
    organisationId: row.organisation_id,
    userId: row.user_id,
    name: row.name,
    displayPrefix: row.display_prefix,
    scope: row.scope,
    expiresAt: row.expires_at,
    lastUsedAt: row.last_used_at,
    revokedAt: row.revoked_at,
    createdAt: row.created_at,
  };
}

const COLUMNS: string[] = [
  'id',
  'organisation_id',
  'user_id',
  'name',
  'display_prefix',
  'scope',
  'expires_at',
  'last_used_at',
  'revoked_at',
  'created_at',
];

const BY_SECRET_HASH_SQL = `select ${COLUMNS.map((c) => `t.${c}`).join(', ')}, m.role as member_role
  from api_tokens t left join memberships m on m.organisation_id = t.organisation_id and m.user_id = t.user_id
  where t.secret_hash = ?`;

/** The PostgreSQL implementation. */
export function createKnexApiTokenStore(db: Knex): ApiTokenStore {
  return {
    async create(input) {
      const [row] = await db('api_tokens')
        .insert({
          organisation_id: input.organisationId,
          user_id: input.userId,
          name: input.name,
          display_prefix: input.displayPrefix,
          secret_hash: input.secretHash,
          scope: input.scope,
          expires_at: input.expiresAt,
        })
        .returning<TokenRow[]>(COLUMNS);
      if (row === undefined) throw new Error('the token was not created');
      return toRecord(row);
    },
    async findBySecretHash(secretHash) {
      // One indexed read per API request, in plain SQL: the token and its user's membership together.
      const { rows } = await db.raw<{ rows: Array<TokenRow & { member_role: Role | null }> }>(BY_SECRET_HASH_SQL, [
        secretHash,
      ]);
      const row = rows[0];
      return row === undefined ? undefined : { ...toRecord(row), memberRole: row.member_role ?? undefined };
    },
    async findById(organisationId, id) {
      const row: TokenRow | undefined = await db('api_tokens')
        .where({ id, organisation_id: organisationId })
        .first(COLUMNS);
      return row === undefined ? undefined : toRecord(row);
    },
    async list(organisationId, userId) {
      const query = db('api_tokens').where({ organisation_id: organisationId });
      if (userId !== undefined) query.andWhere({ user_id: userId });
      const rows: TokenRow[] = await query.select(COLUMNS).orderBy('created_at', 'desc');
      return rows.map(toRecord);
    },
    async markUsed(id, at) {
      await db('api_tokens').where({ id }).update({ last_used_at: at });
    },
    async revoke(id, at) {
      await db('api_tokens').where({ id }).whereNull('revoked_at').update({ revoked_at: at });
    },
  };
}
