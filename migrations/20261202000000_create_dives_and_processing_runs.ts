import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  // One processing of a log (or of one dive of it) with its parameters; kept as history.
  await knex.schema.createTable('processing_runs', (t) => {
    t.uuid('id').primary().defaultTo(knex.fn.uuid());
    t.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    t.uuid('log_id').notNullable().references('logs.id').onDelete('CASCADE');
    // Set when the run reprocesses one dive only; the dive table refers back, so no FK here.
    t.uuid('dive_id');
    // process: read, split, audit, summarise a new log; reprocess: audit again (and re-solve) stored dives.
    t.text('kind').notNullable();
    t.text('status').notNullable().defaultTo('queued');
    t.text('reason');
    t.text('audit_profile').notNullable();
    // The re-solve setup of the run (null: the logged positions are audited as they are).
    t.jsonb('resolve_setup');
    t.jsonb('audit_setup').notNullable().defaultTo('{}');
    t.integer('attempts').notNullable().defaultTo(0);
    t.text('job_id');
    t.uuid('requested_by').references('users.id').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('started_at', { useTz: true });
    t.timestamp('finished_at', { useTz: true });
    t.index(['log_id', 'created_at'], 'processing_runs_log_created_index');
    t.index(['project_id', 'status'], 'processing_runs_project_status_index');
  });
  await knex.raw(
    `alter table processing_runs add constraint processing_runs_status_check check (status in ('queued', 'processing', 'done', 'failed'))`,
  );
  await knex.raw(
    `alter table processing_runs add constraint processing_runs_kind_check check (kind in ('process', 'reprocess'))`,
  );

  // One dive cut out of a log. The columns queried on are copied from the latest result so lists
  // filter and sort with indexes; `summary` holds the latest summary as a whole.
  await knex.schema.createTable('dives', (t) => {
    t.uuid('id').primary().defaultTo(knex.fn.uuid());
    t.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    t.uuid('log_id').notNullable().references('logs.id').onDelete('CASCADE');
    t.integer('dive_number').notNullable();
    t.text('track_name').notNullable();
    t.timestamp('start_time', { useTz: true });
    t.timestamp('end_time', { useTz: true });
    t.double('duration_s');
    t.integer('fix_count').notNullable();
    t.double('max_depth_m');
    t.double('distance_m');
    t.double('bbox_west');
    t.double('bbox_south');
    t.double('bbox_east');
    t.double('bbox_north');
    t.text('verdict');
    t.text('audit_profile');
    t.uuid('latest_result_id');
    t.jsonb('summary').notNullable();
    t.text('search_text').notNullable().defaultTo('');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['log_id', 'dive_number'], { indexName: 'dives_log_number_unique' });
    t.index(['project_id', 'start_time', 'id'], 'dives_project_start_index');
    t.index(['project_id', 'verdict', 'start_time'], 'dives_project_verdict_start_index');
    t.index(['project_id', 'max_depth_m'], 'dives_project_max_depth_index');
  });
  await knex.raw(`alter table dives add constraint dives_verdict_check check (verdict in ('pass', 'warn', 'fail'))`);
  // Box search with PostgreSQL's own geometric types (no extension): `&&` on a GiST index.
  await knex.raw(
    'create index dives_bbox_gist on dives using gist (box(point(bbox_west, bbox_south), point(bbox_east, bbox_north)))',
  );
  await knex.raw(
    `alter table dives add column search tsvector generated always as (to_tsvector('simple', search_text)) stored`,
  );
  await knex.raw('create index dives_search_gin on dives using gin (search)');

  // A dive's fixes: one row per track (the vehicle's and, when the log had one, the surface unit's),
  // its columns little-endian Float64Arrays back to back in one bytea, so the track is one indexed read.
  await knex.schema.createTable('dive_tracks', (t) => {
    t.uuid('dive_id').notNullable().references('dives.id').onDelete('CASCADE');
    t.text('role').notNullable();
    t.integer('fix_count').notNullable();
    t.jsonb('meta').notNullable();
    t.specificType('segment_starts', 'integer[]').notNullable();
    t.binary('source_lines').notNullable();
    // The fix columns present in the log, by name, in the order they sit in `fixes` (each
    // fix_count × 8 bytes); a column the log never gave is absent.
    t.specificType('column_names', 'text[]').notNullable();
    t.binary('fixes').notNullable();
    t.primary(['dive_id', 'role']);
  });

  // What one run made of one dive: verdict, summary, per-fix flags, the report; history of a dive.
  await knex.schema.createTable('dive_results', (t) => {
    t.uuid('id').primary().defaultTo(knex.fn.uuid());
    t.uuid('dive_id').notNullable().references('dives.id').onDelete('CASCADE');
    t.uuid('run_id').notNullable().references('processing_runs.id').onDelete('CASCADE');
    t.text('verdict').notNullable();
    t.text('audit_profile').notNullable();
    t.jsonb('resolve_setup');
    t.jsonb('audit_setup').notNullable();
    t.jsonb('summary').notNullable();
    t.jsonb('report').notNullable();
    t.jsonb('resolve_comparison');
    t.binary('flags').notNullable();
    t.integer('flagged_count').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['dive_id', 'created_at'], 'dive_results_dive_created_index');
    t.unique(['run_id', 'dive_id'], { indexName: 'dive_results_run_dive_unique' });
  });

  await knex.schema.createTable('dive_findings', (t) => {
    t.bigIncrements('id').primary();
    t.uuid('result_id').notNullable().references('dive_results.id').onDelete('CASCADE');
    t.text('check').notNullable();
    t.text('severity').notNullable();
    t.integer('start_index').notNullable();
    t.integer('end_index').notNullable();
    t.timestamp('start_time', { useTz: true });
    t.timestamp('end_time', { useTz: true });
    t.double('measured');
    t.double('limit');
    t.text('unit').notNullable();
    t.text('message').notNullable();
    t.index(['result_id', 'start_index'], 'dive_findings_result_index');
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('dive_findings');
  await knex.schema.dropTable('dive_results');
  await knex.schema.dropTable('dive_tracks');
  await knex.schema.dropTable('dives');
  await knex.schema.dropTable('processing_runs');
}
