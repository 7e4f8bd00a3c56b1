import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { createTestApp, seedOrganisation, signedInAgent, type TestApp } from '../testing/create-test-app.js';

const SAME = ['Sec-Fetch-Site', 'same-origin'] as const;
const READ_FIXTURES = fileURLToPath(new URL('../../../../fixtures/read/in', import.meta.url));

function csvLog(seed: number): Buffer {
  // An invented dive at an invented site; `seed` makes each file's bytes distinct.
  const lines = ['time_utc,lat,lon,depth_m'];
  for (let i = 0; i < 5; i++)
    lines.push(`2026-06-01T10:00:0${i}Z,59.${String(1200000 + seed).padStart(7, '0')},5.2100${i},${10 + i}.0`);
  return Buffer.from(`${lines.join('\n')}\n`);
}

describe('createProjectRoutes', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let organisationId: string;
  let otherOrganisationId: string;
  let admin: ReturnType<typeof request.agent>;
  let editor: ReturnType<typeof request.agent>;
  let projectId: string;
  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database, { uploadLimitBytes: 64 * 1024 });
    ({ organisationId } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
      { email: 'tomas@hollowtide.example', role: 'editor' },
    ]));
    ({ organisationId: otherOrganisationId } = await seedOrganisation(database.db, 'Brinewater Diving', [
      { email: 'odile@brinewater.example', role: 'admin' },
    ]));
    admin = await signedInAgent(testApp, 'maren@hollowtide.example');
    editor = await signedInAgent(testApp, 'tomas@hollowtide.example');
    const created = await admin
      .post(`/api/v1/organisations/${organisationId}/projects`)
      .set(...SAME)
      .send({
        name: 'Skarvfjord cable route',
        client: 'Nordvik Grid',
        site: 'Skarvfjord',
        timeZone: 'Europe/Oslo',
        defaultCrs: 'epsg:25832',
      })
      .expect(201);
    projectId = created.body.project.id;
  });
  afterAll(async () => {
    await testApp.close();
    await database.drop();
  });

  it('creates, lists, changes and refuses a duplicate name with 409', async () => {
    const got = await editor.get(`/api/v1/organisations/${organisationId}/projects/${projectId}`).expect(200);
    expect(got.body.project).toMatchObject({
      name: 'Skarvfjord cable route',
      client: 'Nordvik Grid',
      timeZone: 'Europe/Oslo',
      defaultCrs: 'EPSG:25832',
      auditProfile: 'inspection-rov',
      defaultSetup: null,
      logCount: 0,
    });
    await admin
      .post(`/api/v1/organisations/${organisationId}/projects`)
      .set(...SAME)
      .send({ name: 'Skarvfjord cable route' })
      .expect(409);
    const changed = await admin
      .patch(`/api/v1/organisations/${organisationId}/projects/${projectId}`)
      .set(...SAME)
      .send({ auditProfile: 'work-rov', site: 'Skarvfjord north' })
      .expect(200);
    expect(changed.body.project).toMatchObject({ auditProfile: 'work-rov', site: 'Skarvfjord north' });
    const list = await editor.get(`/api/v1/organisations/${organisationId}/projects`).expect(200);
    expect(list.body.projects.map((p: { name: string }) => p.name)).toEqual(['Skarvfjord cable route']);
  });

  it('answers a bad time zone or CRS with 422 and an unknown field with 400', async () => {
    const zone = await admin
      .post(`/api/v1/organisations/${organisationId}/projects`)
      .set(...SAME)
      .send({ name: 'Bad zone', timeZone: 'Mars/Olympus' })
      .expect(422);
    expect(zone.body.error.message).toMatch(/IANA/);
    const crs = await admin
      .post(`/api/v1/organisations/${organisationId}/projects`)
      .set(...SAME)
      .send({ name: 'Bad CRS', defaultCrs: 'EPSG:999999' })
      .expect(422);
    expect(crs.body.error.details).toEqual({ field: 'defaultCrs' });
    await admin
      .patch(`/api/v1/organisations/${organisationId}/projects/${projectId}`)
      .set(...SAME)
      .send({ colour: 'teal' })
      .expect(400);
  });

  it('keeps projects within their organisation: another organisation’s id answers 404', async () => {
    const odile = await signedInAgent(testApp, 'odile@brinewater.example');
    await odile.get(`/api/v1/organisations/${otherOrganisationId}/projects/${projectId}`).expect(404);
  });

  it('archives the bytes verbatim, returns the existing log for the same file, and serves it back byte for byte', async () => {
    const bytes = Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), csvLog(1), Buffer.from('\r\n')]);
    const sha = createHash('sha256').update(bytes).digest('hex');
    const first = await editor
      .post(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs`)
      .set(...SAME)
      .attach('files', bytes, 'dive-ø-01.csv')
      .expect(201);
    expect(first.body.results[0]).toMatchObject({ status: 'created', fileName: 'dive-ø-01.csv' });
    expect(first.body.results[0].log).toMatchObject({ sha256: sha, sizeBytes: bytes.length, detectedFormat: 'csv' });
    const again = await editor
      .post(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs`)
      .set(...SAME)
      .attach('files', bytes, 'renamed.csv')
      .expect(200);
    expect(again.body.results[0].status).toBe('existing');
    expect(again.body.results[0].log.id).toBe(first.body.results[0].log.id);

    const logId = first.body.results[0].log.id;
    const download = await editor
      .get(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs/${logId}/original`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(Buffer.compare(download.body as Buffer, bytes)).toBe(0);
    expect(download.headers['content-disposition']).toContain("filename*=UTF-8''dive-%C3%B8-01.csv");
    const trail = await database.db('activity').where({ action: 'log-uploaded', subject_id: logId });
    expect(trail).toHaveLength(1);
  });

  it('answers a file above the limit with 413 and keeps nothing', async () => {
    const before = await database.db('logs').count<{ count: string }[]>({ count: '*' });
    const big = Buffer.alloc(65 * 1024, 'x');
    const response = await editor
      .post(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs`)
      .set(...SAME)
      .attach('files', big, 'huge.csv')
      .expect(413);
    expect(response.body.error.code).toBe('payload-too-large');
    const after = await database.db('logs').count<{ count: string }[]>({ count: '*' });
    expect(after).toEqual(before);
  });

  it('rejects unreadable files with a reason and answers 422 when nothing was readable', async () => {
    const response = await editor
      .post(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs`)
      .set(...SAME)
      .attach('files', Buffer.alloc(0), 'empty.csv')
      .attach('files', Buffer.from([0, 1, 2, 3, 255, 254, 0, 0]), 'garbage.bin')
      .expect(422);
    expect(response.body.results.map((r: { error: { code: string } }) => r.error.code)).toEqual([
      'empty-file',
      'binary-content',
    ]);
    expect(response.body.results[1].error.message).toMatch(/^garbage\.bin:1: binary-content: expected /);
    await editor
      .post(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs`)
      .set(...SAME)
      .send({})
      .expect(400);
  });

  it('accepts every readable fixture format and names a reason for every refused file', async () => {
    const names = readdirSync(READ_FIXTURES).filter((n) => !n.endsWith('.options.json'));
    let call = editor.post(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs`).set(...SAME);
    for (const name of names) call = call.attach('files', readFileSync(join(READ_FIXTURES, name)), name);
    const response = await call;
    expect([200, 201]).toContain(response.status);
    expect(response.body.results).toHaveLength(names.length);
    const formats = new Set<string>();
    for (const result of response.body.results) {
      if (result.status === 'rejected') expect(result.error.message.length).toBeGreaterThan(5);
      else formats.add(result.log.detectedFormat);
    }
    expect([...formats].sort()).toEqual(['csv', 'geojson', 'gpx', 'kml', 'nmea']);
    // The hostile XML of the readers' list is answered with a reason and not archived.
    const byName = new Map(response.body.results.map((r: { fileName: string }) => [r.fileName, r]));
    for (const hostile of ['gpx-billion-laughs.gpx', 'gpx-external-entity.gpx'])
      expect(byName.get(hostile)).toMatchObject({ status: 'rejected', error: { code: 'forbidden-xml-construct' } });
    expect(byName.get('binary-garbage.bin')).toMatchObject({ status: 'rejected' });
  });

  it('loses none of 50 concurrent uploads, and stores one log for 10 concurrent copies of one file', async () => {
    const other = await admin
      .post(`/api/v1/organisations/${organisationId}/projects`)
      .set(...SAME)
      .send({ name: 'Concurrent uploads' })
      .expect(201);
    const target = `/api/v1/organisations/${organisationId}/projects/${other.body.project.id}/logs`;
    const distinct = Array.from({ length: 50 }, (_, i) =>
      editor
        .post(target)
        .set(...SAME)
        .attach('files', csvLog(100 + i), `dive-${i}.csv`),
    );
    const same = Array.from({ length: 10 }, () =>
      editor
        .post(target)
        .set(...SAME)
        .attach('files', csvLog(9999), 'same.csv'),
    );
    const responses = await Promise.all([...distinct, ...same]);
    expect(responses.map((r) => r.status).filter((s) => s !== 201 && s !== 200)).toEqual([]);
    const logs = await editor.get(target).expect(200);
    expect(logs.body.logs).toHaveLength(51);
    const sameIds = new Set(responses.slice(50).map((r) => r.body.results[0].log.id));
    expect(sameIds.size).toBe(1);
  });

  it('deletes a log (admin) and then a project with its logs', async () => {
    const list = await admin.get(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs`).expect(200);
    const logId = list.body.logs[0].id;
    await editor
      .delete(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs/${logId}`)
      .set(...SAME)
      .expect(403);
    await admin
      .delete(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs/${logId}`)
      .set(...SAME)
      .expect(204);
    await admin.get(`/api/v1/organisations/${organisationId}/projects/${projectId}/logs/${logId}/original`).expect(404);
    await admin
      .delete(`/api/v1/organisations/${organisationId}/projects/${projectId}`)
      .set(...SAME)
      .expect(204);
    const remaining = await database.db('logs').where({ project_id: projectId });
    expect(remaining).toEqual([]);
    const trail = await database.db('activity').where({ action: 'project-deleted', subject_id: projectId });
    expect(trail).toHaveLength(1);
  });

  it('lets any member watch and unwatch a project', async () => {
    const other = await admin.get(`/api/v1/organisations/${organisationId}/projects`).expect(200);
    const id = other.body.projects[0].id;
    await editor
      .put(`/api/v1/organisations/${organisationId}/projects/${id}/watchers/me`)
      .set(...SAME)
      .expect(204);
    const watchers = await admin.get(`/api/v1/organisations/${organisationId}/projects/${id}/watchers`).expect(200);
    expect(watchers.body.watchers.map((w: { email: string }) => w.email)).toEqual(['tomas@hollowtide.example']);
    await editor
      .delete(`/api/v1/organisations/${organisationId}/projects/${id}/watchers/me`)
      .set(...SAME)
      .expect(204);
    const none = await admin.get(`/api/v1/organisations/${organisationId}/projects/${id}/watchers`).expect(200);
    expect(none.body.watchers).toEqual([]);
  });
});
