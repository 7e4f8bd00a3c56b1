import { createHash } from 'node:crypto';
import { DEMO_SITES, type SeasonOptions, simulateSeason } from '@leadline/core';
import type { Knex } from 'knex';
import { hashPassword } from '../services/password.js';

/** The invented organisation and people of the demo; every name here is made up. */
export const DEMO_ORGANISATION = { name: 'Hollowtide Subsea', slug: 'hollowtide' } as const;
/** The demo sign-in that `npm start` prints. */
export const DEMO_PASSWORD = 'leadline-demo';
/** Demo people, a few of each role; the first is the admin `npm start` prints. */
export const DEMO_USERS = [
  { email: 'maren@hollowtide.example', displayName: 'Maren Alvsaker', role: 'admin' },
  { email: 'tomas@hollowtide.example', displayName: 'Tomas Reyne', role: 'editor' },
  { email: 'ilse@hollowtide.example', displayName: 'Ilse Varga', role: 'viewer' },
  { email: 'jonah@hollowtide.example', displayName: 'Jonah Pellow', role: 'admin' },
  { email: 'aiko@hollowtide.example', displayName: 'Aiko Brannigan', role: 'editor' },
  { email: 'rafe@hollowtide.example', displayName: 'Rafe Okonkwo-Lind', role: 'editor' },
  { email: 'petra@hollowtide.example', displayName: 'Petra Solheimsvik', role: 'viewer' },
  { email: 'dunstan@hollowtide.example', displayName: 'Dunstan Quayle', role: 'viewer' },
] as const;

/** The demo season `npm start` loads: about 40 dives over February–May 2026 at the three demo sites. */
export const DEMO_SEASON: SeasonOptions = { seed: 20260216, dives: 40 };

/** What `loadDemoData` did. */
export interface DemoLoadResult {
  /** True when it created the organisation and people, or the season's projects and logs. */
  loaded: boolean;
  projects: number;
  logs: number;
}

/**
 * Loads the demo into the database: the organisation and its people when no organisation exists
 * yet, then the demo season (one project per site, every dive's log files as uploaded logs, kept
 * byte for byte with their SHA-256) when the demo organisation exists and no project exists yet.
 * Running it again changes nothing. `season` overrides the season (tests load a short one).
 */
export async function loadDemoData(db: Knex, season: SeasonOptions = DEMO_SEASON): Promise<DemoLoadResult> {
  const row = await db('organisations').count<{ count: string }[]>({ count: '*' }).first();
  let loaded = false;
  if (Number(row?.count ?? 0) === 0) {
    await loadOrganisation(db);
    loaded = true;
  }
  const { projects, logs } = await loadSeason(db, season);
  return { loaded: loaded || projects > 0, projects, logs };
}

async function loadOrganisation(db: Knex): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  await db.transaction(async (trx) => {
    const [organisation] = await trx('organisations').insert(DEMO_ORGANISATION).returning<{ id: string }[]>('id');
    if (organisation === undefined) throw new Error('the demo organisation was not created');
    for (const user of DEMO_USERS) {
      const [created] = await trx('users')
        .insert({ email: user.email, display_name: user.displayName, password_hash: passwordHash })
        .returning<{ id: string }[]>('id');
      if (created === undefined) throw new Error(`the demo user ${user.email} was not created`);
      await trx('memberships').insert({ organisation_id: organisation.id, user_id: created.id, role: user.role });
    }
  });
}

async function loadSeason(db: Knex, season: SeasonOptions): Promise<{ projects: number; logs: number }> {
  const organisation = await db('organisations').where({ slug: DEMO_ORGANISATION.slug }).first<{ id: string }>('id');
  if (organisation === undefined) return { projects: 0, logs: 0 };
  const existing = await db('projects').count<{ count: string }[]>({ count: '*' }).first();
  if (Number(existing?.count ?? 0) > 0) return { projects: 0, logs: 0 };
  const editors = await db('users')
    .join('memberships', 'memberships.user_id', 'users.id')
    .where({ 'memberships.organisation_id': organisation.id, 'memberships.role': 'editor' })
    .orderBy('users.email')
    .select<{ id: string }[]>('users.id');

  let projects = 0;
  let logs = 0;
  await db.transaction(async (trx) => {
    const projectIds = new Map<string, string>();
    for (const site of DEMO_SITES) {
      const [project] = await trx('projects')
        .insert({
          organisation_id: organisation.id,
          name: site.projectName,
          client: site.client,
          site: site.name,
          time_zone: site.timeZone,
          default_crs: site.crs,
          created_at: new Date(Date.UTC(2026, 1, 2)),
        })
        .returning<{ id: string }[]>('id');
      if (project === undefined) throw new Error(`the demo project ${site.projectName} was not created`);
      projectIds.set(site.id, project.id);
      projects++;
    }
    let index = 0;
    for (const { dive, files } of simulateSeason(season)) {
      const projectId = projectIds.get(dive.spec.site.id);
      if (projectId === undefined) throw new Error(`no demo project for site ${dive.spec.site.id}`);
      const uploader = editors.length === 0 ? null : (editors[index % editors.length]?.id ?? null);
      // Logs arrive half an hour or so after the dive ends.
      const uploadedAt = new Date(dive.truth.endTimeMs + (20 + (index % 4) * 10) * 60_000);
      for (const file of files) {
        const content = Buffer.from(file.text, 'utf8');
        const inserted = await trx('logs')
          .insert({
            project_id: projectId,
            original_file_name: file.name.slice(file.name.lastIndexOf('/') + 1),
            content,
            sha256: createHash('sha256').update(content).digest('hex'),
            size_bytes: content.byteLength,
            detected_format: null,
            uploaded_by: uploader,
            uploaded_at: uploadedAt,
          })
          .onConflict(['project_id', 'sha256'])
          .ignore()
          .returning('id');
        logs += inserted.length;
      }
      index++;
    }
  });
  return { projects, logs };
}
