import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { createTestApp, seedOrganisation, signedInAgent, type TestApp } from '../testing/create-test-app.js';

const SAME = ['Sec-Fetch-Site', 'same-origin'] as const;

describe('createMemberRoutes', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let organisationId: string;
  let users: Record<string, string>;
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database);
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

  it('lists members with their roles for an admin', async () => {
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    const list = await maren.get(`/api/v1/organisations/${organisationId}/members`).expect(200);
    expect(list.body.members.map((m: { email: string; role: string }) => [m.email, m.role])).toEqual([
      ['ilse@hollowtide.example', 'viewer'],
      ['maren@hollowtide.example', 'admin'],
      ['tomas@hollowtide.example', 'editor'],
    ]);
  });

  it('refuses to leave the organisation without an admin (409)', async () => {
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    const me = users['maren@hollowtide.example'];
    const demote = await maren
      .patch(`/api/v1/organisations/${organisationId}/members/${me}`)
      .set(...SAME)
      .send({ role: 'editor' })
      .expect(409);
    expect(demote.body.error.code).toBe('conflict');
    await maren
      .delete(`/api/v1/organisations/${organisationId}/members/${me}`)
      .set(...SAME)
      .expect(409);
    await maren
      .patch(`/api/v1/organisations/${organisationId}/members/${me}`)
      .set(...SAME)
      .send({ role: 'owner' })
      .expect(400);
  });

  it('removes a member; their tokens stop working and the trail records it', async () => {
    const tomas = await signedInAgent(testApp, 'tomas@hollowtide.example');
    const { body } = await tomas
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set(...SAME)
      .send({ name: 'pipeline', scope: 'read-write' })
      .expect(201);
    await request(testApp.app)
      .get(`/api/v1/organisations/${organisationId}/projects`)
      .set('Authorization', `Bearer ${body.token}`)
      .expect(200);
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    await maren
      .delete(`/api/v1/organisations/${organisationId}/members/${users['tomas@hollowtide.example']}`)
      .set(...SAME)
      .expect(204);
    await request(testApp.app)
      .get(`/api/v1/organisations/${organisationId}/projects`)
      .set('Authorization', `Bearer ${body.token}`)
      .expect(401);
    await tomas.get(`/api/v1/organisations/${organisationId}/projects`).expect(403);
    const trail = await maren.get(`/api/v1/organisations/${organisationId}/activity`).expect(200);
    const actions = trail.body.activity.map((a: { action: string }) => a.action);
    expect(actions).toContain('member-removed');
    expect(actions).toContain('token-created');
  });
});

describe('checkSameOrigin', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let server: Server;
  let port: number;
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database);
    await seedOrganisation(database.db, 'Hollowtide Subsea', [{ email: 'maren@hollowtide.example', role: 'admin' }]);
    server = await new Promise<Server>((resolve) => {
      const s = testApp.app.listen(0, '127.0.0.1', () => resolve(s));
    });
    port = (server.address() as AddressInfo).port;
  });
  afterAll(async () => {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    await testApp.close();
    await database.drop();
  });

  it('accepts an Origin naming this host and refuses any other', async () => {
    const body = { email: 'maren@hollowtide.example', password: 'wrong password' };
    const same = await request(server).post('/api/v1/session').set('Origin', `http://127.0.0.1:${port}`).send(body);
    expect(same.status).toBe(401);
    const other = await request(server)
      .post('/api/v1/session')
      .set('Origin', `http://127.0.0.1:${port + 1}`)
      .send(body);
    expect(other.status).toBe(403);
    const garbage = await request(server).post('/api/v1/session').set('Origin', 'null').send(body);
    expect(garbage.status).toBe(403);
    // A bearer-token client is not a browser: no cookie rides along, so no check applies.
    await request(server)
      .post('/api/v1/organisations')
      .set('Origin', 'https://evil.example')
      .set('Authorization', 'Bearer llt_unknown')
      .send({})
      .expect(401);
  });
});
