import type { Knex } from 'knex';

/** What the activity trail records. */
export type ActivityAction =
  | 'sign-in'
  | 'sign-in-failed'
  | 'sign-out'
  | 'password-reset'
  | 'password-changed'
  | 'invitation-sent'
  | 'invitation-accepted'
  | 'invitation-revoked'
  | 'role-changed'
  | 'member-removed'
  | 'token-created'
  | 'token-revoked'
  | 'project-created'
  | 'project-updated'
  | 'project-deleted'
  | 'log-uploaded'
  | 'log-deleted'
  | 'reprocess-requested';

/** One entry of the activity trail: who did what to which subject, when. */
export interface ActivityRecord {
  id: string;
  organisationId: string | null;
  actorUserId: string | null;
  action: ActivityAction;
  subjectType: string | null;
  subjectId: string | null;
  details: Record<string, unknown>;
  createdAt: Date;
}

/** The input of one entry. */
export interface ActivityInput {
  organisationId?: string | null;
  actorUserId?: string | null;
  action: ActivityAction;
  subjectType?: string;
  subjectId?: string;
  details?: Record<string, unknown>;
}

/** The activity trail, append only. */
export interface ActivityStore {
  append(entry: ActivityInput): Promise<void>;
  /** Newest first; `before` pages by id. */
  list(query: {
    organisationId?: string;
    actorUserId?: string;
    limit: number;
    before?: string;
  }): Promise<ActivityRecord[]>;
}

interface ActivityRow {
  id: string;
  organisation_id: string | null;
  actor_user_id: string | null;
  action: ActivityAction;
  subject_type: string | null;
  subject_id: string | null;
  details: Record<string, unknown>;
  created_at: Date;
}

/** The PostgreSQL implementation. */
export function createKnexActivityStore(db: Knex): ActivityStore {
  return {
    async append(entry) {
      await db('activity').insert({
        organisation_id: entry.organisationId ?? null,
        actor_user_id: entry.actorUserId ?? null,
        action: entry.action,
        subject_type: entry.subjectType ?? null,
        subject_id: entry.subjectId ?? null,
        details: JSON.stringify(entry.details ?? {}),
      });
    },
    async list(query) {
      const q = db<ActivityRow>('activity').select('*').orderBy('id', 'desc').limit(query.limit);
      if (query.organisationId !== undefined) q.where({ organisation_id: query.organisationId });
      if (query.actorUserId !== undefined) q.where({ actor_user_id: query.actorUserId });
      if (query.before !== undefined) q.where('id', '<', query.before);
      const rows = (await q) as ActivityRow[];
      return rows.map((row) => ({
        id: String(row.id),
        organisationId: row.organisation_id,
        actorUserId: row.actor_user_id,
        action: row.action,
        subjectType: row.subject_type,
        subjectId: row.subject_id,
        details: row.details,
        createdAt: row.created_at,
      }));
    },
  };
}
