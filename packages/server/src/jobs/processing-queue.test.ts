import { type ChildProcess, spawn } from 'node:child_process';
import { createHash, randomUUID } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import { planSeason, simulatePlannedDive } from '@leadline/core';
import pino from 'pino';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { startFakeSmtpServer } from '../mail/fake-smtp-server.js';
import { createSmtpMailer } from '../mail/mailer.js';
import { createTestApp, seedOrganisation, signedInAgent, type TestApp } from '../testing/create-test-app.js';
import { PROCESSING_QUEUE } from './processing-queue.js';
import { type Processing, startProcessing } from './start-processing.js';

const SAME = ['Sec-Fetch-Site', 'same-origin'] as const;
const ROOT = fileURLToPath(new URL('../../../../', import.meta.url));
const STALLING_WORKER = fileURLToPath(new URL('../testing/stalling-worker.ts', import.meta.url));

type Agent = ReturnType<typeof request.agent>;

function simulatedCsv(seed: number): { name: string; text: string } {
  const [planned] = planSeason({ seed, dives: 1, diveMinutes: 10, dialect: 'csv' });
  if (planned === undefined) throw new Error('no dive planned');
  const [file] = simulatePlannedDive(planned).files;
  if (file === undefined) throw new Error('no file written');
  return { name: file.name.split('/').pop() ?? file.name, text: file.text };
}

async function runsOf(agent: Agent, base: string, logId: string) {
  return (await agent.get(`${base}/logs/${logId}/runs`).expect(200)).body.runs as Array<{
    status: string;
    attempts: number;
    reason: string | null;
  }>;
}

async function until<T>(what: string, probe: () => Promise<T | undefined>, timeoutMs = 20_000): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value !== undefined) return value;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

describe('startProcessingWorker', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let editor: Agent;
  let base: string;
  const started: Processing[] = [];
  let child: ChildProcess | undefined;

  beforeAll(async () => {
    database = await createTestDatabase();
    // The web side only sends jobs; workers are started by each test.
    const sender = await startProcessing({
      databaseUrl: database.url,
      db: database.db,
      worker: false,
      settings: { expireInS: 1, retryDelayS: 1, retryLimit: 2 },
    });
    started.push(sender);
    testApp = await createTestApp(database, { processingQueue: sender.queue });
    const { organisationId } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'tomas@hollowtide.example', role: 'editor' },
      { email: 'maren@hollowtide.example', role: 'admin' },
    ]);
    const admin = await signedInAgent(testApp, 'maren@hollowtide.example');
    editor = await signedInAgent(testApp, 'tomas@hollowtide.example');
    const project = await admin
      .post(`/api/v1/organisations/${organisationId}/projects`)
      .set(...SAME)
      .send({ name: 'Skarvfjord crash trials' })
      .expect(201);
    base = `/api/v1/organisations/${organisationId}/projects/${project.body.project.id}`;
  });
  afterAll(async () => {
    child?.kill('SIGKILL');
    for (const p of started.reverse()) await p.stop();
    await testApp?.close();
    await database?.drop();
  });

  it('completes a job after its worker was killed mid-job, with the stored log intact', async () => {
    child = spawn(process.execPath, ['--import', 'tsx', STALLING_WORKER], {
      cwd: ROOT,
      env: { ...process.env, DATABASE_URL: database.url },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stdout?.on('data', (chunk: Buffer) => {
      output += chunk.toString();
    });
    child.stderr?.on('data', (chunk: Buffer) => {
      output += chunk.toString();
    });
    await until('the stalling worker to start', async () => (output.includes('ready') ? true : undefined));

    const log = simulatedCsv(21);
    const uploaded = await editor
      .post(`${base}/logs`)
      .set(...SAME)
      .attach('files', Buffer.from(log.text), log.name)
      .expect(201);
    const logId: string = uploaded.body.results[0].log.id;
    await until('the worker to stall mid-job', async () => (output.includes('stalled') ? true : undefined));
    child.kill('SIGKILL');
    await new Promise((resolve) => child?.once('exit', resolve));

    // Killed after the work and before the store: the run is left "processing", nothing half-written.
    const [killed] = await runsOf(editor, base, logId);
    expect(killed).toMatchObject({ status: 'processing', attempts: 1 });
    const [diveCount] = await database.db('dives').where({ log_id: logId }).count<{ count: string }[]>({ count: '*' });
    expect(Number(diveCount?.count)).toBe(0);

    // A new worker (the restart) takes the job up once pg-boss sees it expired, and finishes it.
    const restarted = await startProcessing({
      databaseUrl: database.url,
      db: database.db,
      logger: pino({ level: 'silent' }),
      pollingIntervalS: 0.5,
      maintenanceIntervalS: 1,
    });
    const done = await until('the run to finish after the restart', async () => {
      const [run] = await runsOf(editor, base, logId);
      return run?.status === 'done' || run?.status === 'failed' ? run : undefined;
    });
    await restarted.stop();
    expect(done).toMatchObject({ status: 'done', attempts: 2 });
    const dives = await editor.get(`${base}/dives?logId=${logId}`).expect(200);
    expect(dives.body.total).toBeGreaterThanOrEqual(1);
    const original = await editor.get(`${base}/logs/${logId}/original`).buffer(true).expect(200);
    expect(createHash('sha256').update(original.body).digest('hex')).toBe(
      createHash('sha256').update(log.text).digest('hex'),
    );
  }, 40_000);

  it('retries a failed attempt with the reason shown, then finishes', async () => {
    let failures = 0;
    const flaky = await startProcessing({
      databaseUrl: database.url,
      db: database.db,
      logger: pino({ level: 'silent' }),
      pollingIntervalS: 0.5,
      hooks: {
        beforeStore: async () => {
          if (failures++ === 0) throw new Error('connection reset while storing (simulated)');
        },
      },
    });
    started.push(flaky);
    const log = simulatedCsv(22);
    const uploaded = await editor
      .post(`${base}/logs`)
      .set(...SAME)
      .attach('files', Buffer.from(log.text), log.name)
      .expect(201);
    const logId: string = uploaded.body.results[0].log.id;
    const requeued = await until('the first attempt to fail', async () => {
      const [run] = await runsOf(editor, base, logId);
      return run?.reason?.includes('will retry') ? run : undefined;
    });
    expect(requeued.reason).toMatch(/attempt 1 failed, will retry: connection reset/);
    const done = await until('the retry to finish', async () => {
      const [run] = await runsOf(editor, base, logId);
      return run?.status === 'done' ? run : undefined;
    });
    expect(done).toMatchObject({ attempts: 2, reason: null });
    expect(failures).toBe(2);
  }, 30_000);

  it('gives logs archived without a run (demo data, older archives) their first run when a worker starts', async () => {
    for (const p of started.splice(1)) await p.stop();
    const log = simulatedCsv(23);
    const projectId = base.split('/').pop();
    const [inserted] = await database
      .db('logs')
      .insert({
        project_id: projectId,
        original_file_name: log.name,
        content: Buffer.from(log.text),
        sha256: createHash('sha256').update(log.text).digest('hex'),
        size_bytes: Buffer.byteLength(log.text),
      })
      .returning<{ id: string }[]>('id');
    const logId = inserted?.id ?? '';
    expect(await runsOf(editor, base, logId)).toEqual([]);
    started.push(
      await startProcessing({
        databaseUrl: database.url,
        db: database.db,
        logger: pino({ level: 'silent' }),
        pollingIntervalS: 0.5,
      }),
    );
    const done = await until('the first run of the old log', async () => {
      const [run] = await runsOf(editor, base, logId);
      return run?.status === 'done' ? run : undefined;
    });
    expect(done).toMatchObject({ kind: 'process', attempts: 1 });
  }, 30_000);

  it('marks failed a run whose worker died on its last attempt, so it never stays processing', async () => {
    for (const p of started.splice(1)) await p.stop();
    const log = simulatedCsv(24);
    const uploaded = await editor
      .post(`${base}/logs`)
      .set(...SAME)
      .attach('files', Buffer.from(log.text), log.name)
      .expect(201);
    const logId: string = uploaded.body.results[0].log.id;
    // As pg-boss leaves it after the last expiry: the run still "processing", its job gone. The job the
    // upload queued is removed too, so no worker can pick it up and race the check below.
    await database.db.raw(`delete from pgboss.job where name = ?`, [PROCESSING_QUEUE]);
    await database
      .db('processing_runs')
      .where({ log_id: logId })
      .update({ status: 'processing', attempts: 3, started_at: new Date(Date.now() - 3600_000), job_id: randomUUID() });
    started.push(
      await startProcessing({
        databaseUrl: database.url,
        db: database.db,
        logger: pino({ level: 'silent' }),
        settings: { expireInS: 60 },
      }),
    );
    const [run] = await runsOf(editor, base, logId);
    expect(run).toMatchObject({ status: 'failed' });
    expect(run?.reason).toMatch(/stopped mid-job on every attempt \(3\)/);
  }, 30_000);

  it("mails the project's watchers when a dive fails its audit", async () => {
    for (const p of started.splice(1)) await p.stop();
    const mailbox = await startFakeSmtpServer();
    const mailer = createSmtpMailer(mailbox.url, 'Leadline test <leadline@test.invalid>');
    try {
      started.push(
        await startProcessing({
          databaseUrl: database.url,
          db: database.db,
          logger: pino({ level: 'silent' }),
          pollingIntervalS: 0.5,
          mail: { mailer, publicUrl: 'http://leadline.test' },
        }),
      );
      await editor
        .put(`${base}/watchers/me`)
        .set(...SAME)
        .expect(204);
      // An invented log whose every third fix jumps about 550 m: position jumps fail the audit.
      const lines = ['time_utc,lat,lon,depth_m'];
      for (let i = 0; i < 600; i++) {
        const time = new Date(Date.UTC(2026, 5, 1, 10, 0, 0) + i * 1000).toISOString();
        const jump = i % 3 === 0 ? 0.005 : 0;
        lines.push(`${time},${(59.12 + jump + i * 1e-6).toFixed(7)},${(5.21 + i * 1e-6).toFixed(7)},20.0`);
      }
      const uploaded = await editor
        .post(`${base}/logs`)
        .set(...SAME)
        .attach('files', Buffer.from(`${lines.join('\n')}\n`), 'jumpy-dive.csv')
        .expect(201);
      const logId: string = uploaded.body.results[0].log.id;
      await until('the run to finish', async () => {
        const [run] = await runsOf(editor, base, logId);
        return run?.status === 'done' ? run : undefined;
      });
      const dives = await editor.get(`${base}/dives?logId=${logId}`).expect(200);
      expect(dives.body.dives[0].verdict).toBe('fail');
      const mail = await until('the notice', async () =>
        mailbox.messages().find((m) => m.to.includes('tomas@hollowtide.example')),
      );
      expect(mail.subject).toMatch(/^Failed audit: dive 1, 2026-06-01 10:00 UTC/);
      expect(mail.text).toContain('jumpy-dive.csv');
      expect(mail.text).toContain(`http://leadline.test/dives/${dives.body.dives[0].id}`);
      expect(mail.text).toMatch(/\[fail\] position-jump/);
    } finally {
      mailer.close();
      await mailbox.close();
    }
  }, 30_000);
});
