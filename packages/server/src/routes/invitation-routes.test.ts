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

const SAME = ['Sec-Fetch-Site', 'same-origin'] as const;

async function waitForMail(testApp: TestApp, to: string, count: number) {
  for (let i = 0; i < 100; i++) {
    const messages = testApp.mailbox.messages().filter((m) => m.to.includes(to));
    if (messages.length >= count) return messages;
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
  throw new Error(`no mail to ${to}`);
}

function tokenIn(text: string): string {
  const match = /token=([^\s]+)/.exec(text);
  if (match?.[1] === undefined) throw new Error(`no link in ${text}`);
  return decodeURIComponent(match[1]);
}

describe('createInvitationRoutes', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let organisationId: string;
  let now = new Date('2026-12-01T12:00:00Z');
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database, { now: () => now });
    ({ organisationId } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
      { email: 'ilse@hollowtide.example', role: 'viewer' },
    ]));
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('invites by e-mail over SMTP; the link works once and makes a member who can sign in', async () => {
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    await maren
      .post(`/api/v1/organisations/${organisationId}/invitations`)
      .set(...SAME)
      .send({ email: 'pell@hollowtide.example', role: 'editor' })
      .expect(201);
    const [mail] = await waitForMail(testApp, 'pell@hollowtide.example', 1);
    expect(mail?.subject).toBe('You are invited to Hollowtide Subsea on Leadline');
    expect(mail?.text).toContain('http://leadline.test/accept-invitation?token=');
    const token = tokenIn(mail?.text ?? '');

    const pending = await maren.get(`/api/v1/organisations/${organisationId}/invitations`).expect(200);
    expect(pending.body.invitations.map((i: { email: string }) => i.email)).toEqual(['pell@hollowtide.example']);

    const missing = await request(testApp.app).post('/api/v1/invitations/accept').send({ token }).expect(422);
    expect(missing.body.error.details.fields).toEqual(['displayName', 'password']);
    // The refused attempt did not use the link up.
    const fresh = token;
    const agent = request.agent(testApp.app);
    const accepted = await agent
      .post('/api/v1/invitations/accept')
      .send({ token: fresh, displayName: 'Pell Ostrander', password: 'a long enough password' })
      .expect(200);
    expect(accepted.body).toEqual({ organisationId, role: 'editor' });
    const me = await agent.get('/api/v1/me').expect(200);
    expect(me.body.memberships[0].role).toBe('editor');
    await request(testApp.app)
      .post('/api/v1/invitations/accept')
      .send({ token: fresh, displayName: 'Again', password: 'a long enough password' })
      .expect(404);
    await request(testApp.app)
      .post('/api/v1/session')
      .send({ email: 'pell@hollowtide.example', password: 'a long enough password' })
      .expect(200);
  });

  it('refuses an expired invitation', async () => {
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    await maren
      .post(`/api/v1/organisations/${organisationId}/invitations`)
      .set(...SAME)
      .send({ email: 'late@hollowtide.example', role: 'viewer' })
      .expect(201);
    const [mail] = await waitForMail(testApp, 'late@hollowtide.example', 1);
    now = new Date(now.getTime() + 8 * 86_400_000);
    const response = await request(testApp.app)
      .post('/api/v1/invitations/accept')
      .send({ token: tokenIn(mail?.text ?? ''), displayName: 'Late', password: 'a long enough password' })
      .expect(404);
    expect(response.body.error.message).toMatch(/expired/);
  });

  it('withdraws a pending invitation: its link stops working and it leaves the list', async () => {
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    const sent = await maren
      .post(`/api/v1/organisations/${organisationId}/invitations`)
      .set(...SAME)
      .send({ email: 'withdrawn@hollowtide.example', role: 'editor' })
      .expect(201);
    const [mail] = await waitForMail(testApp, 'withdrawn@hollowtide.example', 1);
    const path = `/api/v1/organisations/${organisationId}/invitations/${sent.body.invitation.id}`;
    const ilse = await signedInAgent(testApp, 'ilse@hollowtide.example');
    await ilse
      .delete(path)
      .set(...SAME)
      .expect(403);

    await maren
      .delete(path)
      .set(...SAME)
      .expect(204);
    const pending = await maren.get(`/api/v1/organisations/${organisationId}/invitations`).expect(200);
    expect(pending.body.invitations.map((i: { email: string }) => i.email)).not.toContain(
      'withdrawn@hollowtide.example',
    );
    await request(testApp.app)
      .post('/api/v1/invitations/accept')
      .send({ token: tokenIn(mail?.text ?? ''), displayName: 'Withdrawn', password: 'a long enough password' })
      .expect(404);
    await maren
      .delete(path)
      .set(...SAME)
      .expect(404);
    const activity = await maren.get(`/api/v1/organisations/${organisationId}/activity`).expect(200);
    expect(activity.body.activity[0]).toMatchObject({
      action: 'invitation-revoked',
      subjectId: sent.body.invitation.id,
    });
  });

  it('answers 409 for inviting an existing member', async () => {
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    await maren
      .post(`/api/v1/organisations/${organisationId}/invitations`)
      .set(...SAME)
      .send({ email: 'ILSE@hollowtide.example', role: 'viewer' })
      .expect(409);
  });

  it('serves the fake mailbox to admins only', async () => {
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    const box = await maren.get('/api/v1/dev/mailbox').query({ to: 'pell@hollowtide.example' }).expect(200);
    expect(box.body.messages).toHaveLength(1);
    expect(box.body.messages[0].subject).toMatch(/invited/);
    const ilse = await signedInAgent(testApp, 'ilse@hollowtide.example');
    await ilse.get('/api/v1/dev/mailbox').expect(403);
  });
});

describe('password reset', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let now = new Date('2026-12-01T12:00:00Z');
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database, { now: () => now, rateLimits: { reset: { windowMs: 60_000, limit: 50 } } });
    await seedOrganisation(database.db, 'Hollowtide Subsea', [{ email: 'ilse@hollowtide.example', role: 'viewer' }]);
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('mails a single-use link, sets the new password and ends existing sessions', async () => {
    const oldSession = await signedInAgent(testApp, 'ilse@hollowtide.example');
    await request(testApp.app).post('/api/v1/password-reset').send({ email: 'ilse@hollowtide.example' }).expect(202);
    const [mail] = await waitForMail(testApp, 'ilse@hollowtide.example', 1);
    expect(mail?.subject).toBe('Reset your Leadline password');
    const token = tokenIn(mail?.text ?? '');
    await request(testApp.app).post('/api/v1/password-reset/complete').send({ token, password: 'short' }).expect(400);
    await request(testApp.app)
      .post('/api/v1/password-reset/complete')
      .send({ token, password: 'a brand new password' })
      .expect(204);
    await request(testApp.app)
      .post('/api/v1/password-reset/complete')
      .send({ token, password: 'another new password' })
      .expect(404);
    await oldSession.get('/api/v1/me').expect(401);
    await request(testApp.app)
      .post('/api/v1/session')
      .send({ email: 'ilse@hollowtide.example', password: TEST_PASSWORD })
      .expect(401);
    await request(testApp.app)
      .post('/api/v1/session')
      .send({ email: 'ilse@hollowtide.example', password: 'a brand new password' })
      .expect(200);
  });

  it('answers an unknown address exactly like a known one and sends nothing', async () => {
    const before = testApp.mailbox.messages().length;
    const response = await request(testApp.app)
      .post('/api/v1/password-reset')
      .send({ email: 'nobody@hollowtide.example' })
      .expect(202);
    expect(response.text).toBe('');
    await new Promise((resolve) => setTimeout(resolve, 100));
    expect(testApp.mailbox.messages()).toHaveLength(before);
  });

  it('refuses a link older than an hour', async () => {
    await request(testApp.app).post('/api/v1/password-reset').send({ email: 'ilse@hollowtide.example' }).expect(202);
    const mails = await waitForMail(testApp, 'ilse@hollowtide.example', 2);
    now = new Date(now.getTime() + 61 * 60_000);
    await request(testApp.app)
      .post('/api/v1/password-reset/complete')
      .send({ token: tokenIn(mails.at(-1)?.text ?? ''), password: 'too late a password' })
      .expect(404);
  });
});
