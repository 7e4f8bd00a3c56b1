import { randomBytes } from 'node:crypto';
import knex, { type Knex } from 'knex';

/**
 * A fresh, migrated database for one test file, cloned from the template that `npm test`
 * migrates (DATABASE_URL). Drop it in `afterAll`.
 */
export async function createTestDatabase(): Promise<{ db: Knex; url: string; drop: () => Promise<void> }> {
  const templateUrl = process.env.DATABASE_URL;
  if (!templateUrl) throw new Error('DATABASE_URL is not set: run the suite with npm test, which starts PostgreSQL');
  const template = new URL(templateUrl);
  const templateName = template.pathname.slice(1);
  const name = `test_${randomBytes(6).toString('hex')}`;
  const adminUrl = new URL(templateUrl);
  adminUrl.pathname = '/postgres';
  const admin = knex({ client: 'pg', connection: adminUrl.toString(), pool: { min: 0, max: 1 } });
  await admin.raw('create database ?? template ??', [name, templateName]);
  const url = new URL(templateUrl);
  url.pathname = `/${name}`;
  const db = knex({ client: 'pg', connection: url.toString(), pool: { min: 0, max: 5 } });
  return {
    db,
    url: url.toString(),
    drop: async () => {
      await db.destroy();
      await admin.raw('drop database if exists ?? with (force)', [name]);
      await admin.destroy();
    },
  };
}
