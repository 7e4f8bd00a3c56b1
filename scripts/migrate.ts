// Runs the knex migrations on DATABASE_URL, then (with --demo) loads the demo data into an empty database.
// Prints one line per step; an expected failure is one line without a stack trace.
import { createDatabase, DEMO_PASSWORD, DEMO_USERS, loadDemoData } from '@leadline/server';
import { MIGRATIONS_DIRECTORY } from '../knexfile.js';

const databaseUrl = process.env.DATABASE_URL;
if (!databaseUrl) {
  process.stderr.write('migrate: DATABASE_URL is not set; npm start and npm test set it for you.\n');
  process.exit(1);
}
const withDemo = process.argv.includes('--demo');
const db = createDatabase(databaseUrl);
try {
  const [batch, names] = (await db.migrate.latest({
    directory: MIGRATIONS_DIRECTORY,
    loadExtensions: ['.ts'],
  })) as [number, string[]];
  process.stdout.write(
    names.length === 0
      ? 'migrations: up to date\n'
      : `migrations: applied ${names.length} in batch ${batch}: ${names.join(', ')}\n`,
  );
  if (withDemo) {
    const { loaded } = await loadDemoData(db);
    const admin = DEMO_USERS[0];
    process.stdout.write(
      loaded
        ? `demo data: loaded (sign in as ${admin.email} / ${DEMO_PASSWORD})\n`
        : 'demo data: database not empty, left as it is\n',
    );
  }
} catch (error) {
  const message = error instanceof Error ? error.message.split('\n')[0] : String(error);
  process.stderr.write(
    `migrate: a migration failed: ${message}. Fix the migration or the database, then run npm start again.\n`,
  );
  process.exitCode = 1;
} finally {
  await db.destroy();
}
