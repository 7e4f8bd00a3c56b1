import { planSeason, simulatePlannedDive, writeGeoJson } from '@leadline/core';
import pino from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { type Processing, startProcessing } from '../jobs/start-processing.js';
import { createKnexDiveStore } from '../stores/dive-store.js';
import { createTestApp, seedOrganisation, signedInAgent, type TestApp } from '../testing/create-test-app.js';

const SAME = ['Sec-Fetch-Site', 'same-origin'] as const;

type Agent = ReturnType<typeof request.agent>;

/** Keeps the body as the bytes sent (after any Content-Encoding was undone by superagent). */
function bytes(res: request.Response, done: (error: Error | null, body: Buffer) => void): void {
  const stream = res as unknown as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (chunk: Buffer) => chunks.push(chunk));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
}

async function waitForRuns(agent: Agent, base: string, logId: string, count: number) {
  const until = Date.now() + 30_000;
  for (;;) {
    const runs = (await agent.get(`${base}/logs/${logId}/runs`).expect(200)).body.runs as Array<{ status: string }>;
    if (runs.length >= count && runs.every((r) => r.status === 'done' || r.status === 'failed')) return runs;
    if (Date.now() > until) throw new Error(`runs not finished: ${JSON.stringify(runs)}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

describe('GET …/dives/:diveId/track (downloadDiveTrack, sendPreparedFile)', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let processing: Processing;
  let testApp: TestApp;
  let editor: Agent;
  let viewer: Agent;
  let base: string;
  let logId: string;
  let diveId: string;
  let track: string;

  beforeAll(async () => {
    database = await createTestDatabase();
    processing = await startProcessing({
      databaseUrl: database.url,
      db: database.db,
      logger: pino({ level: 'silent' }),
      pollingIntervalS: 0.5,
    });
    testApp = await createTestApp(database, { processingQueue: processing.queue });
    const { organisationId } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
      { email: 'tomas@hollowtide.example', role: 'editor' },
      { email: 'ilse@hollowtide.example', role: 'viewer' },
    ]);
    const admin = await signedInAgent(testApp, 'maren@hollowtide.example');
    editor = await signedInAgent(testApp, 'tomas@hollowtide.example');
    viewer = await signedInAgent(testApp, 'ilse@hollowtide.example');
    const project = await admin
      .post(`/api/v1/organisations/${organisationId}/projects`)
      .set(...SAME)
      .send({ name: 'Brennvik cable route', auditProfile: 'inspection-rov' })
      .expect(201);
    base = `/api/v1/organisations/${organisationId}/projects/${project.body.project.id}`;
    const [planned] = planSeason({ seed: 31, dives: 1, diveMinutes: 15, dialect: 'csv' });
    const file = planned === undefined ? undefined : simulatePlannedDive(planned).files[0];
    if (file === undefined) throw new Error('no simulated log');
    const uploaded = await editor
      .post(`${base}/logs`)
      .set(...SAME)
      .attach('files', Buffer.from(file.text), file.name.split('/').pop() ?? file.name)
      .expect(201);
    logId = uploaded.body.results[0].log.id;
    await waitForRuns(viewer, base, logId, 1);
    diveId = (await viewer.get(`${base}/dives?logId=${logId}`).expect(200)).body.dives[0].id;
    track = `${base}/dives/${diveId}/track`;
  }, 60_000); // the upload is processed here: a worker thread first loads the code
  afterAll(async () => {
    await processing?.stop();
    await testApp?.close();
    await database?.drop();
  });

  it("sends core's GeoJSON writer output byte for byte, or its gzip when accepted, each with its own strong ETag", async () => {
    const plain = await viewer
      .get(`${track}?format=geojson`)
      .set('Accept-Encoding', 'identity')
      .buffer(true)
      .parse(bytes)
      .expect(200);
    const stored = await createKnexDiveStore(database.db).tracks(diveId);
    if (stored === undefined) throw new Error('no stored fixes');
    const expected = writeGeoJson({
      tracks: stored.surface === undefined ? [stored.vehicle] : [stored.vehicle, stored.surface],
      waypoints: [],
    });
    expect(Buffer.compare(plain.body as Buffer, Buffer.from(expected, 'utf8'))).toBe(0);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.headers['content-type']).toBe('application/geo+json; charset=utf-8');
    expect(plain.headers['cache-control']).toBe('private, no-cache');
    expect(plain.headers.vary).toMatch(/Accept-Encoding/);
    expect(plain.headers.etag).toMatch(/^"[A-Za-z0-9_-]+"$/); // strong: no W/ prefix

    const zipped = await viewer
      .get(`${track}?format=geojson`)
      .set('Accept-Encoding', 'gzip')
      .buffer(true)
      .parse(bytes)
      .expect(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(Number(zipped.headers['content-length'])).toBeLessThan((plain.body as Buffer).byteLength / 3);
    expect(Buffer.compare(zipped.body as Buffer, plain.body as Buffer)).toBe(0); // superagent undid the gzip
    expect(zipped.headers.etag).not.toBe(plain.headers.etag);
  });

  it('answers 304 without a body when If-None-Match holds the ETag of what it would send, 200 otherwise', async () => {
    const first = await viewer.get(`${track}?format=gpx`).set('Accept-Encoding', 'identity').buffer(true).expect(200);
    const etag = String(first.headers.etag);
    const again = await viewer
      .get(`${track}?format=gpx`)
      .set('Accept-Encoding', 'identity')
      .set('If-None-Match', etag)
      .expect(304);
    expect(again.headers.etag).toBe(etag);
    expect(again.headers['cache-control']).toBe('private, no-cache');
    expect(again.text ?? '').toBe('');
    // RFC 9110 §13.1.2: If-None-Match compares weakly and may list several tags.
    await viewer
      .get(`${track}?format=gpx`)
      .set('Accept-Encoding', 'identity')
      .set('If-None-Match', `"other", W/${etag}`)
      .expect(304);
    await viewer
      .get(`${track}?format=gpx`)
      .set('Accept-Encoding', 'identity')
      .set('If-None-Match', '"other"')
      .expect(200);
    // The GPX keeps the time of its first rendering: the cached bytes are sent again, not rewritten.
    const later = await viewer.get(`${track}?format=gpx`).set('Accept-Encoding', 'identity').buffer(true).expect(200);
    expect(later.text).toBe(first.text);
    // The gzip representation has another tag: holding the plain one does not make it fresh.
    await viewer.get(`${track}?format=gpx`).set('Accept-Encoding', 'gzip').set('If-None-Match', etag).expect(200);
    // Another format is another file.
    await viewer.get(`${track}?format=kml`).set('If-None-Match', etag).expect(200);
  });

  it('serves the same bytes to an API token as to a session, 304 included', async () => {
    const token = await viewer
      .post(`${base.split('/projects/')[0]}/tokens`)
      .set(...SAME)
      .send({ name: 'track reader', scope: 'read', expiresInDays: 1 })
      .expect(201);
    const auth = `Bearer ${token.body.token}`;
    const bySession = await viewer
      .get(`${track}?format=csv`)
      .set('Accept-Encoding', 'identity')
      .buffer(true)
      .expect(200);
    const byToken = await request(testApp.app)
      .get(`${track}?format=csv`)
      .set('Authorization', auth)
      .set('Accept-Encoding', 'identity')
      .buffer(true)
      .expect(200);
    expect(byToken.text).toBe(bySession.text);
    expect(byToken.headers.etag).toBe(bySession.headers.etag);
    expect(byToken.headers['set-cookie']).toBeUndefined();
    await request(testApp.app)
      .get(`${track}?format=csv`)
      .set('Authorization', auth)
      .set('Accept-Encoding', 'identity')
      .set('If-None-Match', String(bySession.headers.etag))
      .expect(304);
    await request(testApp.app).get(`${track}?format=csv`).set('Authorization', 'Bearer llt_unknown').expect(401);
  });

  it("serves a new run's cleaned track after a reprocess, never the cached one, and the same bytes a cold server makes", async () => {
    const get = (agent: Agent, variant: string) =>
      agent
        .get(`${track}?format=geojson&variant=${variant}`)
        .set('Accept-Encoding', 'identity')
        .buffer(true)
        .expect(200);
    const rawBefore = await get(viewer, 'raw');
    const before = await get(viewer, 'cleaned');
    // Smoothing follows the profile: work-rov smooths with 0.25 m/s², inspection-rov with 0.5 m/s².
    await editor
      .post(`${track.replace(/\/track$/, '')}/reprocess`)
      .set(...SAME)
      .send({ auditProfile: 'work-rov' })
      .expect(202);
    await waitForRuns(viewer, base, logId, 2);
    const after = await get(viewer, 'cleaned');
    expect(after.headers.etag).not.toBe(before.headers.etag);
    expect(after.text).not.toBe(before.text);
    await viewer
      .get(`${track}?format=geojson&variant=cleaned`)
      .set('Accept-Encoding', 'identity')
      .set('If-None-Match', String(before.headers.etag))
      .expect(200);
    // The raw fixes did not change, so neither did their file.
    expect((await get(viewer, 'raw')).headers.etag).toBe(rawBefore.headers.etag);
    // A server that never cached anything renders the same bytes.
    const cold = await createTestApp(database, { processingQueue: processing.queue });
    try {
      const coldAgent = await signedInAgent(cold, 'ilse@hollowtide.example');
      const fresh = await get(coldAgent, 'cleaned');
      expect(fresh.text).toBe(after.text);
      expect(fresh.headers.etag).toBe(after.headers.etag);
    } finally {
      await cold.close();
    }
  });

  it('says which is missing: an unknown dive is 404, and so is a dive asked for under another project', async () => {
    const other = await viewer.get(`${base}/dives/00000000-0000-4000-8000-000000000000/track`).expect(404);
    expect(other.body.error.message).toMatch(/No dive/);
    const wrongProject = track.replace(/projects\/[0-9a-f-]+/, 'projects/00000000-0000-4000-8000-000000000000');
    const missing = await viewer.get(wrongProject).expect(404);
    expect(missing.body.error.message).toMatch(/No project/);
  });
});
