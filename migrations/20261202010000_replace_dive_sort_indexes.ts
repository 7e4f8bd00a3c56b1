import type { Knex } from 'knex';

// Dive lists sort by a column then the id, both the same direction, with PostgreSQL's default null
// order; one index per sortable column (scanned either way) then serves a page without a sort.
const SORTED = ['start_time', 'max_depth_m', 'duration_s', 'distance_m'] as const;

export async function up(knex: Knex): Promise<void> {
  await knex.raw('drop index if exists dives_project_start_index');
  await knex.raw('drop index if exists dives_project_verdict_start_index');
  await knex.raw('drop index if exists dives_project_max_depth_index');
  for (const column of SORTED)
    await knex.raw(`create index dives_project_${column}_id_index on dives (project_id, ${column}, id)`);
  await knex.raw(
    'create index dives_project_verdict_start_time_id_index on dives (project_id, verdict, start_time, id)',
  );
}

export async function down(knex: Knex): Promise<void> {
  for (const column of SORTED) await knex.raw(`drop index if exists dives_project_${column}_id_index`);
  await knex.raw('drop index if exists dives_project_verdict_start_time_id_index');
  await knex.raw('create index dives_project_start_index on dives (project_id, start_time, id)');
  await knex.raw('create index dives_project_verdict_start_index on dives (project_id, verdict, start_time)');
  await knex.raw('create index dives_project_max_depth_index on dives (project_id, max_depth_m)');
}
