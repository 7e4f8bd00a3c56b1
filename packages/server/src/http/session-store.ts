import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import pg from 'pg';

/** The session store: connect-pg-simple over its own small pool, in the `user_sessions` table the migrations create. */
export function createPgSessionStore(
  databaseUrl: string,
  options: { pruneIntervalS?: number | false; onError?: (error: Error) => void } = {},
) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 3 });
  // An idle connection the database drops (restart, admin shutdown) must not crash the server; the
  // pool opens a new one on the next request (node-postgres asks every pool to handle this event).
  pool.on('error', options.onError ?? (() => undefined));
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
