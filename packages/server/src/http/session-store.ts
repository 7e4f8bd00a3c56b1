import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import pg from 'pg';

/** The session store: connect-pg-simple over its own small pool, in the `user_sessions` table the migrations create. */
export function createPgSessionStore(databaseUrl: string, options: { pruneIntervalS?: number | false } = {}) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 3 });
  const PgStore = connectPgSimple(session);
  const store = new PgStore({
    pool,
    tableName: 'user_sessions',
    createTableIfMissing: false,
    pruneSessionInterval: options.pruneIntervalS ?? 15 * 60,
  });
  return {
    store,
    close: async () => {
      store.close();
      await pool.end().catch(() => undefined);
    },
  };
}
