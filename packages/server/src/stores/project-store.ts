import type { Knex } from 'knex';

/** A project of an organisation with its settings. */
export interface ProjectRecord {
  id: string;
  organisationId: string;
  name: string;
  client: string | null;
  site: string | null;
  timeZone: string;
  defaultCrs: string | null;
  auditProfile: string;
  defaultSetup: unknown;
  createdAt: Date;
  updatedAt: Date;
  logCount: number;
}

/** The settings a project is created or changed with. */
export interface ProjectFields {
  name: string;
  client: string | null;
  site: string | null;
  timeZone: string;
  defaultCrs: string | null;
  auditProfile: string;
  defaultSetup: unknown;
}

/** Projects and their watchers, always within one organisation. */
export interface ProjectStore {
  list(organisationId: string): Promise<ProjectRecord[]>;
  find(organisationId: string, projectId: string): Promise<ProjectRecord | undefined>;
  /** `undefined` when the organisation already has a project of that name. */
  create(organisationId: string, fields: ProjectFields): Promise<ProjectRecord | undefined>;
  /** `'duplicate-name'` when another project of the organisation has the new name. */
  update(
    organisationId: string,
    projectId: string,
    fields: Partial<ProjectFields>,
  ): Promise<'ok' | 'missing' | 'duplicate-name'>;
  delete(organisationId: string, projectId: string): Promise<boolean>;
  watchers(projectId: string): Promise<Array<{ userId: string; email: string; displayName: string }>>;
  setWatching(projectId: string, userId: string, watching: boolean): Promise<void>;
}

interface ProjectRow {
  id: string;
  organisation_id: string;
  name: string;
  client: string | null;
  site: string | null;
  time_zone: string;
  default_crs: string | null;
  audit_profile: string;
  default_setup: unknown;
  created_at: Date;
  updated_at: Date;
  log_count: string | number;
}

function toRecord(row: ProjectRow): ProjectRecord {
  return {
    id: row.id,
    organisationId: row.organisation_id,
    name: row.name,
    client: row.client,
    site: row.site,
    timeZone: row.time_zone,
    defaultCrs: row.default_crs,
    auditProfile: row.audit_profile,
    defaultSetup: row.default_setup,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
    logCount: Number(row.log_count),
  };
}

function toRow(fields: Partial<ProjectFields>): Record<string, unknown> {
  const row: Record<string, unknown> = {};
  if (fields.name !== undefined) row.name = fields.name;
  if (fields.client !== undefined) row.client = fields.client;
  if (fields.site !== undefined) row.site = fields.site;
  if (fields.timeZone !== undefined) row.time_zone = fields.timeZone;
  if (fields.defaultCrs !== undefined) row.default_crs = fields.defaultCrs;
  if (fields.auditProfile !== undefined) row.audit_profile = fields.auditProfile;
  if (fields.defaultSetup !== undefined)
    row.default_setup = fields.defaultSetup === null ? null : JSON.stringify(fields.defaultSetup);
  return row;
}

const UNIQUE_VIOLATION = '23505';

function isUniqueViolation(error: unknown): boolean {
  return typeof error === 'object' && error !== null && (error as { code?: unknown }).code === UNIQUE_VIOLATION;
}

/** The PostgreSQL implementation. */
export function createKnexProjectStore(db: Knex): ProjectStore {
  const select = () =>
    db('projects').select(
      'projects.*',
      db.raw('(select count(*) from logs where logs.project_id = projects.id) as log_count'),
    );
  return {
    async list(organisationId) {
      const rows: ProjectRow[] = await select().where('projects.organisation_id', organisationId).orderBy('name');
      return rows.map(toRecord);
    },
    async find(organisationId, projectId) {
      const row: ProjectRow | undefined = await select()
        .where({ 'projects.organisation_id': organisationId, 'projects.id': projectId })
        .first();
      return row === undefined ? undefined : toRecord(row);
    },
    async create(organisationId, fields) {
      try {
        const [row] = await db('projects')
          .insert({ organisation_id: organisationId, ...toRow(fields) })
          .returning<ProjectRow[]>('*');
        return row === undefined ? undefined : toRecord({ ...row, log_count: 0 });
      } catch (error) {
        if (isUniqueViolation(error)) return undefined;
        throw error;
      }
    },
    async update(organisationId, projectId, fields) {
      try {
        const count = await db('projects')
          .where({ organisation_id: organisationId, id: projectId })
          .update({ ...toRow(fields), updated_at: db.fn.now() });
        return count === 0 ? 'missing' : 'ok';
      } catch (error) {
        if (isUniqueViolation(error)) return 'duplicate-name';
        throw error;
      }
    },
    async delete(organisationId, projectId) {
      const count = await db('projects').where({ organisation_id: organisationId, id: projectId }).delete();
      return count > 0;
    },
    async watchers(projectId) {
      const rows: Array<{ user_id: string; email: string; display_name: string }> = await db('project_watchers')
        .join('users', 'users.id', 'project_watchers.user_id')
        .where('project_watchers.project_id', projectId)
        .select('project_watchers.user_id', 'users.email', 'users.display_name')
        .orderBy('users.display_name');
      return rows.map((row) => ({ userId: row.user_id, email: row.email, displayName: row.display_name }));
    },
    async setWatching(projectId, userId, watching) {
      if (watching)
        await db('project_watchers').insert({ project_id: projectId, user_id: userId }).onConflict().ignore();
      else await db('project_watchers').where({ project_id: projectId, user_id: userId }).delete();
    },
  };
}
