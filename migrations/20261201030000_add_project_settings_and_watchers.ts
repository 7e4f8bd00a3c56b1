import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('projects', (t) => {
    // The audit profile a log of this project is checked with unless a run names another.
    t.text('audit_profile').notNullable().defaultTo('inspection-rov');
    // The re-solve setup (sound speed, lever arm, draft, ...) used by default; null for none.
    t.jsonb('default_setup');
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  // Who gets the failed-audit notice of a project.
  await knex.schema.createTable('project_watchers', (t) => {
    t.uuid('project_id').notNullable().references('projects.id').onDelete('CASCADE');
    t.uuid('user_id').notNullable().references('users.id').onDelete('CASCADE');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['project_id', 'user_id']);
    t.index(['user_id']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('project_watchers');
  await knex.schema.alterTable('projects', (t) => {
    t.dropColumn('updated_at');
    t.dropColumn('default_setup');
    t.dropColumn('audit_profile');
  });
}
