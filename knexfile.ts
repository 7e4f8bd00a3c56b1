import { fileURLToPath } from 'node:url';
import type { Knex } from 'knex';

/** Where the migrations live, for the migrate script, the tests and the knex command line. */
export const MIGRATIONS_DIRECTORY = fileURLToPath(new URL('./migrations', import.meta.url));

const config: Knex.Config = {
  client: 'pg',
  connection: process.env.DATABASE_URL,
  migrations: { directory: MIGRATIONS_DIRECTORY, loadExtensions: ['.ts'], extension: 'ts' },
};

export default config;
