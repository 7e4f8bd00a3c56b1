import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  // The table connect-pg-simple expects (its own table.sql), under our name.
  await knex.schema.createTable('user_sessions', (t) => {
    t.string('sid').primary();
    t.json('sess').notNullable();
    t.timestamp('expire', { precision: 6 }).notNullable().index('user_sessions_expire_index');
  });

  await knex.schema.createTable('api_tokens', (t) => {
    t.uuid('id').primary().defaultTo(knex.fn.uuid());
    t.uuid('organisation_id').notNullable().references('organisations.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('name').notNullable();
    // The first characters of the token, kept to recognise it in lists; never enough to use it.
    t.text('display_prefix').notNullable();
    // SHA-256 (hex) of the whole token; the token itself is never stored.
    t.text('secret_hash').notNullable().unique();
    t.text('scope').notNullable().checkIn(['read', 'read-write'], 'api_tokens_scope_check');
    t.timestamp('expires_at', { useTz: true });
    t.timestamp('last_used_at', { useTz: true });
    t.timestamp('revoked_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['organisation_id', 'user_id']);
  });

  // Single-use links sent by e-mail: invitations and password resets.
  await knex.schema.createTable('email_links', (t) => {
    t.uuid('id').primary().defaultTo(knex.fn.uuid());
    t.text('kind').notNullable().checkIn(['invitation', 'password-reset'], 'email_links_kind_check');
    t.text('secret_hash').notNullable().unique();
    t.text('email').notNullable();
    t.uuid('organisation_id').references('organisations.id').onDelete('CASCADE');
    t.text('role').checkIn(['admin', 'editor', 'viewer'], 'email_links_role_check');
    t.uuid('created_by').references('users.id').onDelete('SET NULL');
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  await knex.schema.createTable('activity', (t) => {
    t.bigIncrements('id').primary();
    t.uuid('organisation_id').references('organisations.id').onDelete('CASCADE');
    t.uuid('actor_user_id').references('users.id').onDelete('SET NULL');
    t.text('action').notNullable();
    t.text('subject_type');
    t.text('subject_id');
    t.jsonb('details').notNullable().defaultTo('{}');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.index(['organisation_id', 'created_at']);
    t.index(['actor_user_id', 'created_at']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('activity');
  await knex.schema.dropTable('email_links');
  await knex.schema.dropTable('api_tokens');
  await knex.schema.dropTable('user_sessions');
}
