import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { type FakeSmtpServer, startFakeSmtpServer } from '../mail/fake-smtp-server.js';
import { createSmtpMailer, type Mailer } from '../mail/mailer.js';
import { createKnexProjectStore } from '../stores/project-store.js';
import { seedOrganisation } from '../testing/create-test-app.js';
import { notifyFailedAudit } from './audit-notice-service.js';

describe('notifyFailedAudit', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let mailbox: FakeSmtpServer;
  let mailer: Mailer;
  beforeAll(async () => {
    database = await createTestDatabase();
    mailbox = await startFakeSmtpServer();
    mailer = createSmtpMailer(mailbox.url, 'Leadline test <leadline@test.invalid>');
  });
  afterAll(async () => {
    mailer.close();
    await mailbox.close();
    await database.drop();
  });

  it('mails each watcher of the project once, listing the findings, and nobody else', async () => {
    const { organisationId, users } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
      { email: 'tomas@hollowtide.example', role: 'editor' },
      { email: 'ilse@hollowtide.example', role: 'viewer' },
    ]);
    const projects = createKnexProjectStore(database.db);
    const project = await projects.create(organisationId, {
      name: 'Skarvfjord cable route',
      client: null,
      site: null,
      timeZone: 'UTC',
      defaultCrs: null,
      auditProfile: 'inspection-rov',
      defaultSetup: null,
    });
    if (project === undefined) throw new Error('project not created');
    for (const email of ['maren@hollowtide.example', 'ilse@hollowtide.example'])
      await projects.setWatching(project.id, users[email] ?? '', true);
    const findings = Array.from({ length: 12 }, (_, i) => ({
      check: 'position-jump',
      severity: 'fail',
      message: `fix ${i + 100} jumps 48.0 m from its neighbours`,
    }));
    const sent = await notifyFailedAudit(
      { projects, mailer, publicUrl: 'http://leadline.test/' },
      {
        organisationId,
        projectId: project.id,
        logFileName: 'skarv-0601.csv',
        diveLabel: 'dive 3',
        divePath: '/dives/abc',
        findings,
      },
    );
    expect(sent).toBe(2);
    for (let i = 0; i < 100 && mailbox.messages().length < 2; i++) await new Promise((r) => setTimeout(r, 20));
    const messages = mailbox.messages();
    expect(messages.flatMap((m) => m.to).sort()).toEqual(['ilse@hollowtide.example', 'maren@hollowtide.example']);
    expect(messages[0]?.subject).toBe('Failed audit: dive 3 in Skarvfjord cable route');
    expect(messages[0]?.text).toContain('[fail] position-jump: fix 100 jumps 48.0 m from its neighbours');
    expect(messages[0]?.text).toContain('… and 2 more');
    expect(messages[0]?.text).toContain('http://leadline.test/dives/abc');
  });

  it('sends nothing for a project of another organisation', async () => {
    const before = mailbox.messages().length;
    const projects = createKnexProjectStore(database.db);
    const sent = await notifyFailedAudit(
      { projects, mailer, publicUrl: 'http://leadline.test' },
      {
        organisationId: '00000000-0000-4000-8000-000000000000',
        projectId: '00000000-0000-4000-8000-000000000001',
        logFileName: 'x.csv',
        diveLabel: 'dive 1',
        divePath: '/',
        findings: [],
      },
    );
    expect(sent).toBe(0);
    expect(mailbox.messages()).toHaveLength(before);
  });
});
