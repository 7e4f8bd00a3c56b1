import type { Knex } from 'knex';

/** What the health route needs to know of the database. */
export interface HealthStore {
  /** Round-trips one query; throws when the database cannot be reached. */
  ping(): Promise<void>;
  /** Names of the migrations applied, oldest first; empty when none table exists yet. */
  appliedMigrations(): Promise<string[]>;
}

/** The PostgreSQL implementation. */
export function createKnexHealthStore(db: Knex): HealthStore {
  return {
    async ping() {
      await db.raw('select 1');
    },
    async appliedMigrations() {
      const exists = await db.schema.hasTable('knex_migrations');
      if (!exists) return [];
      const rows: Array<{ name: string }> = await db('knex_migrations').select('name').orderBy('id');
      return rows.map((row) => row.name);
    },
  };
}
