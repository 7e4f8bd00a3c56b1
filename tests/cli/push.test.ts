import { readFileSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { fileURLToPath } from 'node:url';
import { runPush } from '@leadline/cli';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  createTestApp,
  seedOrganisation,
  signedInAgent,
  type TestApp,
} from '../../packages/server/src/testing/create-test-app.js';
import { createTestDatabase } from '../support/test-database.js';

const FIXTURES = fileURLToPath(new URL('../../fixtures/read/in', import.meta.url));

function captureIo() {
  const out: string[] = [];
  const err: string[] = [];
  return { out, err, io: { isTty: false, stdout: (t: string) => out.push(t), stderr: (t: string) => err.push(t) } };
}

describe('leadline push against a real server and PostgreSQL', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let server: Server;
  let baseUrl: string;
  let token: string;
  let projectId: string;
  let organisationId: string;

  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database);
    server = await new Promise((resolve) => {
      const listening = testApp.app.listen(0, '127.0.0.1', () => resolve(listening));
    });
    baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    ({ organisationId } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
    ]));
    const maren = await signedInAgent(testApp, 'maren@hollowtide.example');
    const project = await maren
      .post(`/api/v1/organisations/${organisationId}/projects`)
      .set('Sec-Fetch-Site', 'same-origin')
      .send({ name: 'Quay survey', timeZone: 'Europe/Oslo' })
      .expect(201);
    projectId = project.body.project.id;
    const created = await maren
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set('Sec-Fetch-Site', 'same-origin')
      .send({ name: 'push test', scope: 'read-write', expiresInDays: 1 })
      .expect(201);
    token = created.body.token;
  });
  afterAll(async () => {
    await new Promise<void>((resolve) => {
      server.closeAllConnections();
      server.close(() => resolve());
    });
    await testApp.close();
    await database.drop();
  });

  it('archives new files, recognises them when pushed again, and keeps the bytes verbatim', async () => {
    const files = ['csv-plain-decimal.csv', 'gpx-1.1-two-tracks.gpx'];
    const args = {
      inputs: files,
      server: baseUrl,
      project: projectId,
      token,
      jobs: 2,
      json: true,
      quiet: false,
      cwd: FIXTURES,
    };
    const first = captureIo();
    expect(await runPush(args, first.io)).toBe(0);
    const results = JSON.parse(first.out.join(''));
    expect(results.map((r: { status: string }) => r.status)).toEqual(['created', 'created']);

    const again = captureIo();
    expect(await runPush(args, again.io)).toBe(0);
    const second = JSON.parse(again.out.join(''));
    expect(second.map((r: { status: string }) => r.status)).toEqual(['existing', 'existing']);
    expect(second[0].logId).toBe(results[0].logId);

    const original = await request(testApp.app)
      .get(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs/${results[0].logId}/original`)
      .set('Authorization', `Bearer ${token}`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(Buffer.compare(original.body as Buffer, readFileSync(`${FIXTURES}/csv-plain-decimal.csv`))).toBe(0);
  });

  it('reports a file the server refuses and exits 3, naming the file', async () => {
    const { io, err } = captureIo();
    const code = await runPush(
      {
        inputs: ['binary-garbage.bin'],
        server: baseUrl,
        project: projectId,
        token,
        jobs: 1,
        json: false,
        quiet: true,
        cwd: FIXTURES,
      },
      io,
    );
    expect(code).toBe(3);
    expect(err.join('')).toMatch(/^binary-garbage\.bin: rejected: /m);
  });

  it('refuses to run without a token, and names a project the token cannot reach', async () => {
    const missing = captureIo();
    expect(
      await runPush(
        {
          inputs: ['csv-plain-decimal.csv'],
          server: baseUrl,
          project: projectId,
          token: undefined,
          jobs: 1,
          json: false,
          quiet: true,
          cwd: FIXTURES,
        },
        missing.io,
      ),
    ).toBe(2);
    expect(missing.err.join('')).toMatch(/LEADLINE_TOKEN/);
    const unknown = captureIo();
    const otherProject = '00000000-0000-4000-8000-000000000000';
    expect(
      await runPush(
        {
          inputs: ['csv-plain-decimal.csv'],
          server: baseUrl,
          project: otherProject,
          token,
          jobs: 1,
          json: false,
          quiet: true,
          cwd: FIXTURES,
        },
        unknown.io,
      ),
    ).toBe(2);
    expect(unknown.err.join('')).toMatch(/not in any organisation this token can reach/);
  });
});
