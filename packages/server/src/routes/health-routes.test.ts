import { LEADLINE_VERSION } from '@leadline/core';
import knex from 'knex';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { createApp } from '../app.js';
import { createKnexHealthStore } from '../stores/health-store.js';

describe('GET /api/v1/health', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  beforeAll(async () => {
    database = await createTestDatabase();
  });
  afterAll(async () => {
    await database.drop();
  });

  it('reports the version and a reachable, migrated database', async () => {
    const app = createApp({ healthStore: createKnexHealthStore(database.db) });
    const response = await request(app).get('/api/v1/health').expect(200);
    expect(response.body.version).toBe(LEADLINE_VERSION);
    expect(response.body.status).toBe('ok');
    expect(response.body.database.state).toBe('up');
    expect(response.body.database.migrationsApplied).toBeGreaterThanOrEqual(1);
    expect(response.body.database.latestMigration).toMatch(/^\d{14}_[a-z0-9_]+\.ts$/);
  });

  it('answers 503 with the database down when PostgreSQL cannot be reached', async () => {
    // Port 1 on loopback has no PostgreSQL: a real refused connection, not a stub.
    const unreachable = knex({ client: 'pg', connection: 'postgres://app@127.0.0.1:1/none', pool: { min: 0, max: 1 } });
    try {
      const app = createApp({ healthStore: createKnexHealthStore(unreachable) });
      const response = await request(app).get('/api/v1/health').expect(503);
      expect(response.body.status).toBe('degraded');
      expect(response.body.database.state).toBe('down');
      expect(response.body.database.error).toMatch(/ECONNREFUSED/);
    } finally {
      await unreachable.destroy();
    }
  });

  it('answers an unknown API path with the one error body and 404', async () => {
    const app = createApp({ healthStore: createKnexHealthStore(database.db) });
    const response = await request(app).get('/api/v1/no-such-thing').expect(404);
    expect(response.body).toEqual({
      error: { code: 'not-found', message: 'No API route for GET /api/v1/no-such-thing' },
    });
  });
});
