import { LEADLINE_VERSION } from '@leadline/core';
import knex from 'knex';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { createKnexHealthStore } from '../stores/health-store.js';
import { createTestApp, type TestApp } from '../testing/create-test-app.js';

describe('GET /api/v1/health', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database);
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('reports the version and a reachable, migrated database', async () => {
    const response = await request(testApp.app).get('/api/v1/health').expect(200);
    expect(response.body.version).toBe(LEADLINE_VERSION);
    expect(response.body.status).toBe('ok');
    expect(response.body.database.state).toBe('up');
    expect(response.body.database.migrationsApplied).toBeGreaterThanOrEqual(1);
    expect(response.body.database.latestMigration).toMatch(/^\d{14}_[a-z0-9_]+\.ts$/);
  });

  it('answers 503 with the database down when PostgreSQL cannot be reached', async () => {
    // Port 1 on loopback has no PostgreSQL: a real refused connection, not a stub.
    const unreachable = knex({ client: 'pg', connection: 'postgres://app@127.0.0.1:1/none', pool: { min: 0, max: 1 } });
    const down = await createTestApp(database, { healthStore: createKnexHealthStore(unreachable) });
    try {
      const response = await request(down.app).get('/api/v1/health').expect(503);
      expect(response.body.status).toBe('degraded');
      expect(response.body.database.state).toBe('down');
      expect(response.body.database.error).toMatch(/ECONNREFUSED/);
      const ready = await request(down.app).get('/api/v1/ready').expect(503);
      expect(ready.body.ready).toBe(false);
      expect(ready.body.reason).toMatch(/database down/);
    } finally {
      await down.close();
      await unreachable.destroy();
    }
  });

  it('answers an unknown API path with the one error body and 404', async () => {
    const response = await request(testApp.app).get('/api/v1/no-such-thing').expect(404);
    expect(response.body).toEqual({
      error: { code: 'not-found', message: 'No API route for GET /api/v1/no-such-thing' },
    });
  });
});

describe('GET /api/v1/ready', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database);
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('is ready on a migrated database and echoes a request id', async () => {
    const response = await request(testApp.app).get('/api/v1/ready').set('X-Request-Id', 'abc-123').expect(200);
    expect(response.body).toEqual({ ready: true });
    expect(response.headers['x-request-id']).toBe('abc-123');
  });

  it('gives every request an id of its own when the caller sends none', async () => {
    const a = await request(testApp.app).get('/api/v1/ready');
    const b = await request(testApp.app).get('/api/v1/ready');
    expect(a.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    expect(a.headers['x-request-id']).not.toBe(b.headers['x-request-id']);
  });
});
