import type { Express } from 'express';
import type { Knex } from 'knex';
import pino from 'pino';
import request from 'supertest';
import { type AppDependencies, buildApp } from '../app.js';
import type { RouteSpec } from '../http/route-table.js';
import { createPgSessionStore } from '../http/session-store.js';
import { type FakeSmtpServer, startFakeSmtpServer } from '../mail/fake-smtp-server.js';
import { createSmtpMailer, type Mailer } from '../mail/mailer.js';
import { hashPassword } from '../services/password.js';
import type { Role } from '../services/roles.js';

/** An app on a test database with a real session store and a real (fake) SMTP server, and helpers to seed it. */
export interface TestApp {
  app: Express;
  routes: readonly RouteSpec[];
  mailbox: FakeSmtpServer;
  close(): Promise<void>;
}

/** Builds the app for route tests; `overrides` replace any dependency. */
export async function createTestApp(
  database: { db: Knex; url: string },
  overrides: Partial<AppDependencies> = {},
): Promise<TestApp> {
  const sessions = createPgSessionStore(database.url, { pruneIntervalS: false });
  const mailbox = await startFakeSmtpServer();
  const mailer: Mailer = createSmtpMailer(mailbox.url, 'Leadline test <leadline@test.invalid>');
  const { app, routes } = buildApp({
    db: database.db,
    sessionStore: sessions.store,
    sessionSecret: 'test-session-secret-of-at-least-32-chars',
    mailer,
    fakeMailbox: mailbox,
    publicUrl: 'http://leadline.test',
    logger: pino({ level: 'silent' }),
    ...overrides,
  });
  return {
    app,
    routes,
    mailbox,
    close: async () => {
      mailer.close();
      await sessions.close();
      await mailbox.close();
    },
  };
}

/** Password every seeded test user has. */
export const TEST_PASSWORD = 'correct horse battery staple';

let sharedHash: Promise<string> | undefined;

/** Inserts an organisation and one user per role given; returns their ids. */
export async function seedOrganisation(
  db: Knex,
  name: string,
  people: Array<{ email: string; role: Role }>,
): Promise<{ organisationId: string; users: Record<string, string> }> {
  sharedHash ??= hashPassword(TEST_PASSWORD);
  const passwordHash = await sharedHash;
  const slug = `${name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${Math.random().toString(36).slice(2, 8)}`;
  const [organisation] = await db('organisations').insert({ name, slug }).returning<{ id: string }[]>('id');
  if (organisation === undefined) throw new Error('organisation not created');
  const users: Record<string, string> = {};
  for (const person of people) {
    const [user] = await db('users')
      .insert({ email: person.email, display_name: person.email.split('@')[0], password_hash: passwordHash })
      .onConflict(db.raw('(lower(email))'))
      .merge()
      .returning<{ id: string }[]>('id');
    if (user === undefined) throw new Error('user not created');
    await db('memberships').insert({ organisation_id: organisation.id, user_id: user.id, role: person.role });
    users[person.email] = user.id;
  }
  return { organisationId: organisation.id, users };
}

/** A supertest agent signed in as `email` (keeps the session cookie). */
export async function signedInAgent(testApp: TestApp, email: string) {
  const agent = request.agent(testApp.app);
  await agent
    .post('/api/v1/session')
    .set('Sec-Fetch-Site', 'same-origin')
    .send({ email, password: TEST_PASSWORD })
    .expect(200);
  return agent;
}
