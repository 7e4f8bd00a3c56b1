import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { createTestApp, seedOrganisation, signedInAgent, type TestApp } from '../testing/create-test-app.js';

const SAME = ['Sec-Fetch-Site', 'same-origin'] as const;

describe('createOrganisationRoutes', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let organisationId: string;
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database);
    ({ organisationId } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
      { email: 'ilse@hollowtide.example', role: 'viewer' },
    ]));
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('creates an organisation whose creator is its admin, and refuses a taken short name with 409', async () => {
    const ilse = await signedInAgent(testApp, 'ilse@hollowtide.example');
    const created = await ilse
      .post('/api/v1/organisations')
      .set(...SAME)
      .send({ name: 'Varga Survey', slug: 'varga-survey' })
      .expect(201);
    const id = created.body.organisation.id;
    const got = await ilse.get(`/api/v1/organisations/${id}`).expect(200);
    expect(got.body).toMatchObject({ organisation: { name: 'Varga Survey', slug: 'varga-survey' }, role: 'admin' });
    await ilse
      .post('/api/v1/organisations')
      .set(...SAME)
      .send({ name: 'Again', slug: 'varga-survey' })
      .expect(409);
    await ilse
      .post('/api/v1/organisations')
      .set(...SAME)
      .send({ name: 'Bad', slug: 'Not A Slug' })
      .expect(400);
  });

  it('lets an admin rename the organisation and a viewer only read it', async () => {
    const ilse = await signedInAgent(testApp, 'ilse@hollowtide.example');
    const read = await ilse.get(`/api/v1/organisations/${organisationId}`).expect(200);
    expect(read.body.role).toBe('viewer');
    await ilse
      .patch(`/api/v1/organisations/${organisationId}`)
      .set(...SAME)
      .send({ name: 'Nope' })
      .expect(403);
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    const renamed = await maren
      .patch(`/api/v1/organisations/${organisationId}`)
      .set(...SAME)
      .send({ name: 'Hollowtide Subsea AS' })
      .expect(200);
    expect(renamed.body.organisation.name).toBe('Hollowtide Subsea AS');
  });
});
