import type { Knex } from 'knex';
import type { Role } from '../services/roles.js';

/** A user as the services see it; the password hash stays in the store except for sign-in. */
export interface UserRecord {
  id: string;
  email: string;
  displayName: string;
  createdAt: Date;
}

/** An organisation the user belongs to, with the role held there. */
export interface MembershipRecord {
  organisationId: string;
  organisationName: string;
  organisationSlug: string;
  role: Role;
}

/** A member of one organisation. */
export interface MemberRecord {
  userId: string;
  email: string;
  displayName: string;
  role: Role;
  joinedAt: Date;
}

/** Users, organisations, memberships and the sessions that belong to a user. */
export interface UserStore {
  findUserByEmail(email: string): Promise<(UserRecord & { passwordHash: string | null }) | undefined>;
  findUserById(id: string): Promise<UserRecord | undefined>;
  createUser(input: { email: string; displayName: string; passwordHash: string }): Promise<UserRecord>;
  setPasswordHash(userId: string, passwordHash: string): Promise<void>;
  membershipsOf(userId: string): Promise<MembershipRecord[]>;
  roleOf(organisationId: string, userId: string): Promise<Role | undefined>;
  organisationExists(organisationId: string): Promise<boolean>;
  /** `undefined` when the slug is taken. */
  createOrganisation(input: { name: string; slug: string }): Promise<{ id: string } | undefined>;
  findOrganisation(
    organisationId: string,
  ): Promise<{ id: string; name: string; slug: string; createdAt: Date } | undefined>;
  renameOrganisation(organisationId: string, name: string): Promise<void>;
  listMembers(organisationId: string): Promise<MemberRecord[]>;
  /** Adds the membership, or leaves an existing one as it is; reports whether it added. */
  addMembership(organisationId: string, userId: string, role: Role): Promise<boolean>;
  setRole(organisationId: string, userId: string, role: Role): Promise<void>;
  removeMembership(organisationId: string, userId: string): Promise<void>;
  countAdmins(organisationId: string): Promise<number>;
  /** Ends every browser session of a user (after a password reset). */
  deleteSessionsOfUser(userId: string): Promise<number>;
}

interface UserRow {
  id: string;
  email: string;
  display_name: string;
  password_hash: string | null;
  created_at: Date;
}

function toUser(row: UserRow): UserRecord {
  return { id: row.id, email: row.email, displayName: row.display_name, createdAt: row.created_at };
}

/** The PostgreSQL implementation. */
export function createKnexUserStore(db: Knex): UserStore {
  return {
    async findUserByEmail(email) {
      const row = await db<UserRow>('users').whereRaw('lower(email) = lower(?)', [email]).first();
      return row === undefined ? undefined : { ...toUser(row), passwordHash: row.password_hash };
    },
    async findUserById(id) {
      const row = await db<UserRow>('users').where({ id }).first();
      return row === undefined ? undefined : toUser(row);
    },
    async createUser(input) {
      const [row] = await db<UserRow>('users')
        .insert({ email: input.email, display_name: input.displayName, password_hash: input.passwordHash })
        .returning('*');
      if (row === undefined) throw new Error('the user was not created');
      return toUser(row);
    },
    async setPasswordHash(userId, passwordHash) {
      await db('users').where({ id: userId }).update({ password_hash: passwordHash });
    },
    async membershipsOf(userId) {
      const rows: Array<{ organisation_id: string; name: string; slug: string; role: Role }> = await db('memberships')
        .join('organisations', 'organisations.id', 'memberships.organisation_id')
        .where('memberships.user_id', userId)
        .select('memberships.organisation_id', 'organisations.name', 'organisations.slug', 'memberships.role')
        .orderBy('organisations.name');
      return rows.map((row) => ({
        organisationId: row.organisation_id,
        organisationName: row.name,
        organisationSlug: row.slug,
        role: row.role,
      }));
    },
    async roleOf(organisationId, userId) {
      const row: { role: Role } | undefined = await db('memberships')
        .where({ organisation_id: organisationId, user_id: userId })
        .first('role');
      return row?.role;
    },
    async organisationExists(organisationId) {
      const row = await db('organisations').where({ id: organisationId }).first('id');
      return row !== undefined;
    },
    async createOrganisation(input) {
      const [row] = await db('organisations')
        .insert(input)
        .onConflict('slug')
        .ignore()
        .returning<{ id: string }[]>('id');
      return row;
    },
    async findOrganisation(organisationId) {
      const row: { id: string; name: string; slug: string; created_at: Date } | undefined = await db('organisations')
        .where({ id: organisationId })
        .first('id', 'name', 'slug', 'created_at');
      return row === undefined ? undefined : { id: row.id, name: row.name, slug: row.slug, createdAt: row.created_at };
    },
    async renameOrganisation(organisationId, name) {
      await db('organisations').where({ id: organisationId }).update({ name });
    },
    async listMembers(organisationId) {
      const rows: Array<{ user_id: string; email: string; display_name: string; role: Role; created_at: Date }> =
        await db('memberships')
          .join('users', 'users.id', 'memberships.user_id')
          .where('memberships.organisation_id', organisationId)
          .select(
            'memberships.user_id',
            'users.email',
            'users.display_name',
            'memberships.role',
            'memberships.created_at',
          )
          .orderBy('users.display_name');
      return rows.map((row) => ({
        userId: row.user_id,
        email: row.email,
        displayName: row.display_name,
        role: row.role,
        joinedAt: row.created_at,
      }));
    },
    async addMembership(organisationId, userId, role) {
      const rows = await db('memberships')
        .insert({ organisation_id: organisationId, user_id: userId, role })
        .onConflict(['organisation_id', 'user_id'])
        .ignore()
        .returning('user_id');
      return rows.length > 0;
    },
    async setRole(organisationId, userId, role) {
      await db('memberships').where({ organisation_id: organisationId, user_id: userId }).update({ role });
    },
    async removeMembership(organisationId, userId) {
      await db('memberships').where({ organisation_id: organisationId, user_id: userId }).delete();
    },
    async countAdmins(organisationId) {
      const row = await db('memberships')
        .where({ organisation_id: organisationId, role: 'admin' })
        .count<{ count: string }[]>({ count: '*' })
        .first();
      return Number(row?.count ?? 0);
    },
    async deleteSessionsOfUser(userId) {
      return db('user_sessions').whereRaw(`sess->>'userId' = ?`, [userId]).delete();
    },
  };
}
