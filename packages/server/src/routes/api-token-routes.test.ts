import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { hashSecret } from '../services/secrets.js';
import { createTestApp, seedOrganisation, signedInAgent, type TestApp } from '../testing/create-test-app.js';

const SAME = ['Sec-Fetch-Site', 'same-origin'] as const;

describe('createApiTokenRoutes', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let organisationId: string;
  let users: Record<string, string>;
  let now = new Date('2026-12-01T12:00:00Z');
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database, { now: () => now });
    ({ organisationId, users } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
      { email: 'tomas@hollowtide.example', role: 'editor' },
      { email: 'ilse@hollowtide.example', role: 'viewer' },
    ]));
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('shows the secret once, stores only its SHA-256, and the token then authenticates', async () => {
    const tomas = await signedInAgent(testApp, 'tomas@hollowtide.example');
    const created = await tomas
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set(...SAME)
      .send({ name: 'survey pipeline', scope: 'read-write', expiresInDays: 30 })
      .expect(201);
    const token: string = created.body.token;
    expect(token).toMatch(/^llt_[A-Za-z0-9_-]{43}$/);
    expect(created.body.apiToken.displayPrefix).toBe(token.slice(0, 10));
    expect(created.body.apiToken.expiresAt).toBe('2026-12-31T12:00:00.000Z');
    const row = await database.db('api_tokens').where({ id: created.body.apiToken.id }).first();
    expect(row.secret_hash).toBe(hashSecret(token));
    expect(JSON.stringify(row)).not.toContain(token);
    const listed = await tomas.get(`/api/v1/organisations/${organisationId}/tokens`).expect(200);
    expect(JSON.stringify(listed.body)).not.toContain(token);

    const me = await request(testApp.app).get('/api/v1/me').set('Authorization', `Bearer ${token}`).expect(200);
    expect(me.body.user.id).toBe(users['tomas@hollowtide.example']);
    const used = await database.db('api_tokens').where({ id: created.body.apiToken.id }).first();
    expect(used.last_used_at).not.toBeNull();
  });

  it('keeps "last used" to the minute instead of writing it on every request', async () => {
    const tomas = await signedInAgent(testApp, 'tomas@hollowtide.example');
    const created = await tomas
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set(...SAME)
      .send({ name: 'busy pipeline', scope: 'read', expiresInDays: 30 })
      .expect(201);
    const lastUsed = async () =>
      (await database.db('api_tokens').where({ id: created.body.apiToken.id }).first()).last_used_at.getTime();
    const call = () =>
      request(testApp.app).get('/api/v1/me').set('Authorization', `Bearer ${created.body.token}`).expect(200);
    const start = now;
    await call();
    const first = await lastUsed();
    now = new Date(start.getTime() + 30_000);
    await call();
    expect(await lastUsed()).toBe(first);
    now = new Date(start.getTime() + 61_000);
    await call();
    expect(await lastUsed()).toBe(start.getTime() + 61_000);
    now = start;
  });

  it('lets a viewer create read tokens only', async () => {
    const ilse = await signedInAgent(testApp, 'ilse@hollowtide.example');
    const refused = await ilse
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set(...SAME)
      .send({ name: 'too much', scope: 'read-write' })
      .expect(403);
    expect(refused.body.error.message).toMatch(/read tokens only/);
    await ilse
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set(...SAME)
      .send({ name: 'dashboard', scope: 'read' })
      .expect(201);
  });

  it('never grants more than the user holds now: a demoted editor’s read-write token can no longer write', async () => {
    const tomas = await signedInAgent(testApp, 'tomas@hollowtide.example');
    const { body } = await tomas
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set(...SAME)
      .send({ name: 'writer', scope: 'read-write' })
      .expect(201);
    const bearer = `Bearer ${body.token}`;
    // An editor's token cannot do admin work.
    await request(testApp.app)
      .get(`/api/v1/organisations/${organisationId}/members`)
      .set('Authorization', bearer)
      .expect(403);
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    await maren
      .patch(`/api/v1/organisations/${organisationId}/members/${users['tomas@hollowtide.example']}`)
      .set(...SAME)
      .send({ role: 'viewer' })
      .expect(204);
    // Revoking one's own token is a write: a viewer's session may, a viewer-capped token acting as viewer may too,
    // but creating a token needs a session.
    await request(testApp.app)
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set('Authorization', bearer)
      .send({ name: 'x', scope: 'read' })
      .expect(403);
    await maren
      .patch(`/api/v1/organisations/${organisationId}/members/${users['tomas@hollowtide.example']}`)
      .set(...SAME)
      .send({ role: 'editor' })
      .expect(204);
    const trail = await maren.get(`/api/v1/organisations/${organisationId}/activity`).expect(200);
    const roleChanges = trail.body.activity.filter((a: { action: string }) => a.action === 'role-changed');
    expect(roleChanges.map((a: { details: unknown }) => a.details)).toEqual([
      { from: 'viewer', to: 'editor' },
      { from: 'editor', to: 'viewer' },
    ]);
  });

  it('stops answering to a revoked or an expired token with 401', async () => {
    const tomas = await signedInAgent(testApp, 'tomas@hollowtide.example');
    const revoked = await tomas
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set(...SAME)
      .send({ name: 'short-lived', scope: 'read', expiresInDays: 1 })
      .expect(201);
    const bearer = `Bearer ${revoked.body.token}`;
    await request(testApp.app).get('/api/v1/me').set('Authorization', bearer).expect(200);
    now = new Date(now.getTime() + 2 * 86_400_000);
    const expired = await request(testApp.app).get('/api/v1/me').set('Authorization', bearer).expect(401);
    expect(expired.body.error.message).toMatch(/unknown, revoked or expired/);

    const other = await tomas
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set(...SAME)
      .send({ name: 'to revoke', scope: 'read-write' })
      .expect(201);
    await request(testApp.app).get('/api/v1/me').set('Authorization', `Bearer ${other.body.token}`).expect(200);
    const done = await tomas
      .delete(`/api/v1/organisations/${organisationId}/tokens/${other.body.apiToken.id}`)
      .set(...SAME)
      .expect(200);
    expect(done.body.apiToken.revokedAt).not.toBeNull();
    await request(testApp.app).get('/api/v1/me').set('Authorization', `Bearer ${other.body.token}`).expect(401);
    const trail = await database.db('activity').where({ action: 'token-revoked', subject_id: other.body.apiToken.id });
    expect(trail).toHaveLength(1);
  });

  it("lets an admin revoke anyone's token but not a viewer another's", async () => {
    const tomas = await signedInAgent(testApp, 'tomas@hollowtide.example');
    const { body } = await tomas
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set(...SAME)
      .send({ name: 'shared', scope: 'read' })
      .expect(201);
    const ilse = await signedInAgent(testApp, 'ilse@hollowtide.example');
    await ilse
      .delete(`/api/v1/organisations/${organisationId}/tokens/${body.apiToken.id}`)
      .set(...SAME)
      .expect(404);
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    const all = await maren.get(`/api/v1/organisations/${organisationId}/tokens`).expect(200);
    expect(all.body.apiTokens.some((t: { id: string }) => t.id === body.apiToken.id)).toBe(true);
    await maren
      .delete(`/api/v1/organisations/${organisationId}/tokens/${body.apiToken.id}`)
      .set(...SAME)
      .expect(200);
  });

  it('acts only in the organisation it was made in, even for a user who is admin elsewhere', async () => {
    const { organisationId: elsewhere } = await seedOrganisation(database.db, 'Brinewater Diving', [
      { email: 'tomas@hollowtide.example', role: 'admin' },
    ]);
    const tomas = await signedInAgent(testApp, 'tomas@hollowtide.example');
    const { body } = await tomas
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set(...SAME)
      .send({ name: 'hollowtide only', scope: 'read-write' })
      .expect(201);
    await tomas.get(`/api/v1/organisations/${elsewhere}/members`).expect(200);
    const refused = await request(testApp.app)
      .get(`/api/v1/organisations/${elsewhere}/members`)
      .set('Authorization', `Bearer ${body.token}`)
      .expect(403);
    expect(refused.body.error.message).toMatch(/another organisation/);
  });

  it('refuses an unknown token and a non-bearer Authorization header with 401', async () => {
    await request(testApp.app).get('/api/v1/me').set('Authorization', 'Bearer llt_nothing').expect(401);
    const basic = await request(testApp.app).get('/api/v1/me').set('Authorization', 'Basic dTpw').expect(401);
    expect(basic.body.error.message).toMatch(/Bearer/);
  });
});
