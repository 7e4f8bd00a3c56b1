import { Writable } from 'node:stream';
import pino from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { createTestApp, seedOrganisation, TEST_PASSWORD, type TestApp } from '../testing/create-test-app.js';

describe('createRequestLogger', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let organisationId: string;
  const lines: string[] = [];
  beforeAll(async () => {
    database = await createTestDatabase();
    const sink = new Writable({
      write(chunk, _encoding, callback) {
        lines.push(...String(chunk).trim().split('\n'));
        callback();
      },
    });
    testApp = await createTestApp(database, { logger: pino({ level: 'info' }, sink) });
    ({ organisationId } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
    ]));
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('writes one JSON line per request with its id, and never a password, token or cookie', async () => {
    const agent = request.agent(testApp.app);
    const signIn = await agent
      .post('/api/v1/session')
      .set('Sec-Fetch-Site', 'same-origin')
      .set('X-Request-Id', 'sign-in-1')
      .send({ email: 'maren@hollowtide.example', password: TEST_PASSWORD })
      .expect(200);
    const cookie = String(signIn.headers['set-cookie']).split(';')[0]?.split('=')[1] ?? '';
    const created = await agent
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set('Sec-Fetch-Site', 'same-origin')
      .send({ name: 'pipeline', scope: 'read' })
      .expect(201);
    const token: string = created.body.token;
    await request(testApp.app).get('/api/v1/me').set('Authorization', `Bearer ${token}`).expect(200);
    await request(testApp.app).get(`/api/v1/me?token=${token}`).expect(401);

    const entries = lines.map((line) => JSON.parse(line) as { req?: { id: string; path: string } });
    const requests = entries.filter((e) => e.req !== undefined);
    expect(requests).toHaveLength(4);
    expect(requests[0]?.req).toEqual({ id: 'sign-in-1', method: 'POST', path: '/api/v1/session' });
    const all = lines.join('\n');
    expect(cookie.length).toBeGreaterThan(10);
    for (const secret of [TEST_PASSWORD, token, cookie, token.slice(4)]) expect(all).not.toContain(secret);
  });
});
