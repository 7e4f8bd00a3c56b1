import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('organisations', (t) => {
    t.uuid('id').primary().defaultTo(knex.fn.uuid());
    t.text('name').notNullable();
    t.text('slug').notNullable().unique();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.schema.createTable('users', (t) => {
    t.uuid('id').primary().defaultTo(knex.fn.uuid());
    t.text('email').notNullable();
    t.text('display_name').notNullable();
    t.text('password_hash');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  // E-mail addresses are compared without regard to case.
  await knex.raw('create unique index users_email_lower_unique on users (lower(email))');
  await knex.schema.createTable('memberships', (t) => {
    t.uuid('organisation_id').notNullable().references('organisations.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.text('role').notNullable().checkIn(['admin', 'editor', 'viewer'], 'memberships_role_check');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['organisation_id', 'user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('memberships');
  await knex.schema.dropTable('users');
  await knex.schema.dropTable('organisations');
}
