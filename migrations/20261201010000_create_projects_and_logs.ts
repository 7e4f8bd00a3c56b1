import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('projects', (t) => {
    t.uuid('id').primary().defaultTo(knex.fn.uuid());
    t.uuid('organisation_id').notNullable().references('organisations.id').onDelete('CASCADE');
    t.text('name').notNullable();
    t.text('client');
    t.text('site');
    // An IANA zone name (e.g. Europe/Oslo) for showing and reading local times.
    t.text('time_zone').notNullable().defaultTo('UTC');
    // The client's CRS as an EPSG code (e.g. EPSG:25832); null until someone sets it.
    t.text('default_crs');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['organisation_id', 'name'], { indexName: 'projects_organisation_name_unique' });
  });

  // An uploaded file, kept byte for byte; everything derived from it lives in other tables.
  await knex.schema.createTable('logs', (t) => {
    t.uuid('id').primary().defaultTo(knex.fn.uuid());
    t.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    t.text('original_file_name').notNullable();
    t.binary('content').notNullable();
    t.text('sha256').notNullable();
    t.bigInteger('size_bytes').notNullable();
    // The reader's verdict on the format (gpx, csv, nmea, geojson, kml); null until processed.
    t.text('detected_format');
    t.uuid('uploaded_by').references('users.id').onDelete('SET NULL');
    t.timestamp('uploaded_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    // The same bytes uploaded to the same project again are the same log (idempotent upload).
    t.unique(['project_id', 'sha256'], { indexName: 'logs_project_sha256_unique' });
    t.index(['project_id', 'uploaded_at'], 'logs_project_uploaded_at_index');
  });
  await knex.raw(`alter table logs add constraint logs_sha256_hex_check check (sha256 ~ '^[0-9a-f]{64}$')`);
  await knex.raw('alter table logs add constraint logs_size_check check (size_bytes = octet_length(content))');
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('logs');
  await knex.schema.dropTable('projects');
}
