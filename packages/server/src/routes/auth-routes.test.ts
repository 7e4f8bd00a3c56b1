import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import {
  createTestApp,
  seedOrganisation,
  signedInAgent,
  TEST_PASSWORD,
  type TestApp,
} from '../testing/create-test-app.js';

describe('createAuthRoutes', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let organisationId: string;
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database, { rateLimits: { signIn: { windowMs: 60_000, limit: 30 } } });
    ({ organisationId } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
      { email: 'ilse@hollowtide.example', role: 'viewer' },
    ]));
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('signs in with a session cookie that is HttpOnly and SameSite, and knows the user afterwards', async () => {
    const agent = request.agent(testApp.app);
    const response = await agent
      .post('/api/v1/session')
      .set('Sec-Fetch-Site', 'same-origin')
      .send({ email: 'MAREN@hollowtide.example', password: TEST_PASSWORD })
      .expect(200);
    const cookie = String(response.headers['set-cookie']);
    expect(cookie).toMatch(/^leadline\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(response.body.user.email).toBe('maren@hollowtide.example');
    expect(response.body).not.toHaveProperty('user.passwordHash');
    const me = await agent.get('/api/v1/me').expect(200);
    expect(me.body.memberships).toEqual([
      { organisationId, organisationName: 'Hollowtide Subsea', organisationSlug: expect.any(String), role: 'admin' },
    ]);
  });

  it('refuses a wrong password with 401 and the one error body, and records the attempt', async () => {
    const response = await request(testApp.app)
      .post('/api/v1/session')
      .send({ email: 'ilse@hollowtide.example', password: 'not the password' })
      .expect(401);
    expect(response.body).toEqual({
      error: { code: 'unauthenticated', message: 'The e-mail address or the password is wrong.' },
    });
    const rows = await database.db('activity').where({ action: 'sign-in-failed' });
    expect(rows.some((row) => row.details.email === 'ilse@hollowtide.example')).toBe(true);
  });

  it('answers a malformed body with 400 naming the field, never 500', async () => {
    const response = await request(testApp.app).post('/api/v1/session').send({ email: 'not-an-address' }).expect(400);
    expect(response.body.error.code).toBe('bad-request');
    expect(response.body.error.details.issues.map((i: { path: string }) => i.path).sort()).toEqual([
      'email',
      'password',
    ]);
    const broken = await request(testApp.app)
      .post('/api/v1/session')
      .set('Content-Type', 'application/json')
      .send('{"email": ')
      .expect(400);
    expect(broken.body.error.code).toBe('bad-request');
  });

  it('refuses a cross-site sign-out (CSRF) and accepts the same-origin one', async () => {
    const agent = await signedInAgent(testApp, 'ilse@hollowtide.example');
    const crossSite = await agent.delete('/api/v1/session').set('Origin', 'https://evil.example').expect(403);
    expect(crossSite.body.error.message).toMatch(/Cross-site/);
    await agent.delete('/api/v1/session').set('Sec-Fetch-Site', 'cross-site').expect(403);
    await agent.get('/api/v1/me').expect(200);
    await agent.delete('/api/v1/session').set('Sec-Fetch-Site', 'same-origin').expect(204);
    await agent.get('/api/v1/me').expect(401);
  });

  it('changes the password only with the current one', async () => {
    const agent = await signedInAgent(testApp, 'ilse@hollowtide.example');
    const wrong = await agent
      .put('/api/v1/me/password')
      .set('Sec-Fetch-Site', 'same-origin')
      .send({ currentPassword: 'not it', newPassword: 'a fresh long password' })
      .expect(401);
    expect(wrong.body.error.message).toBe('The current password is wrong.');
    await agent
      .put('/api/v1/me/password')
      .set('Sec-Fetch-Site', 'same-origin')
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a fresh long password' })
      .expect(204);
    await request(testApp.app)
      .post('/api/v1/session')
      .send({ email: 'ilse@hollowtide.example', password: 'a fresh long password' })
      .expect(200);
  });

  it('answers a JSON body over the limit with 413', async () => {
    const response = await request(testApp.app)
      .post('/api/v1/session')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.example', password: 'x'.repeat(2 * 1024 * 1024) }))
      .expect(413);
    expect(response.body.error.code).toBe('payload-too-large');
  });

  it('is anonymous without a cookie', async () => {
    const response = await request(testApp.app).get('/api/v1/me').expect(401);
    expect(response.body.error.code).toBe('unauthenticated');
  });
});

describe('sign-in rate limit', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database, { rateLimits: { signIn: { windowMs: 60_000, limit: 3 } } });
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('counts guesses at one account across client addresses', async () => {
    // X-Forwarded-For counts because the app trusts its loopback proxy: each request looks like a new address.
    const attempt = (i: number) =>
      request(testApp.app)
        .post('/api/v1/session')
        .set('X-Forwarded-For', `198.51.100.${i}`)
        .send({ email: 'Target@hollowtide.example', password: `guess ${i}` });
    for (let i = 0; i < 3; i++) expect((await attempt(i)).status).toBe(401);
    const limited = await attempt(99);
    expect(limited.status).toBe(429);
    expect(limited.body.error.message).toMatch(/for this account/);
  });

  it('answers 429 with the one error body once the limit is used up', async () => {
    const attempt = () =>
      request(testApp.app).post('/api/v1/session').send({ email: 'nobody@hollowtide.example', password: 'guess' });
    for (let i = 0; i < 3; i++) expect((await attempt()).status).toBe(401);
    const limited = await attempt();
    expect(limited.status).toBe(429);
    expect(limited.body.error.code).toBe('too-many-requests');
  });
});
