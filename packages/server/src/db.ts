import knex, { type Knex } from 'knex';

/** Opens a knex pool on a PostgreSQL URL. The caller destroys it. */
export function createDatabase(databaseUrl: string): Knex {
  return knex({ client: 'pg', connection: databaseUrl, pool: { min: 0, max: 10 } });
}
