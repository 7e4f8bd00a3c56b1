import { execFileSync } from 'node:child_process';
import { createHash, randomUUID } from 'node:crypto';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { planSeason, simulatePlannedDive } from '@leadline/core';
import pino from 'pino';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase } from '../../../../tests/support/test-database.js';
import { type Processing, startProcessing } from '../jobs/start-processing.js';
import { createTestApp, seedOrganisation, signedInAgent, type TestApp } from '../testing/create-test-app.js';

const SAME = ['Sec-Fetch-Site', 'same-origin'] as const;
const GPX_XSD = fileURLToPath(new URL('../../../core/src/read/schemas/gpx-1.1.xsd', import.meta.url));
const READ_FIXTURES = fileURLToPath(new URL('../../../../fixtures/read/in', import.meta.url));

type Agent = ReturnType<typeof request.agent>;

/** A simulated 20-minute dive (1 200 fixes at 1 Hz) as the simulator's plain CSV layout with raw observations. */
function simulatedLog(seed: number): { name: string; text: string; trueSetup: Record<string, unknown> } {
  const [planned] = planSeason({ seed, dives: 1, diveMinutes: 20, dialect: 'csv' });
  if (planned === undefined) throw new Error('no dive planned');
  const dive = simulatePlannedDive(planned);
  const [file] = dive.files;
  if (file === undefined) throw new Error('no file written');
  const t = dive.dive.truth.trueSetup;
  return {
    name: file.name.split('/').pop() ?? file.name,
    text: file.text,
    trueSetup: {
      name: 'true setup from the simulator',
      soundSpeed: {
        loggedMps: dive.dive.truth.loggedSetup.soundSpeedMps,
        water: { method: 'value', soundSpeedMps: t.soundSpeedMps, source: 'simulator truth' },
      },
      bearingReference: { value: 'relative', source: 'simulator' },
      headingOffset: { valueDeg: t.installationOffsetDeg, source: 'simulator truth' },
      declination: { method: 'value', valueDeg: t.declinationDeg, source: 'simulator truth' },
      leverArm: { ...t.leverArm, source: 'simulator truth' },
      transceiverDraft: { valueM: t.draftM, source: 'simulator truth' },
    },
  };
}

async function waitForRuns(agent: Agent, base: string, logId: string, count = 1, timeoutMs = 20_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const response = await agent.get(`${base}/logs/${logId}/runs`).expect(200);
    const runs = response.body.runs as Array<{ status: string; reason: string | null }>;
    if (runs.length >= count && runs.every((r) => r.status === 'done' || r.status === 'failed')) return runs;
    if (Date.now() > until) throw new Error(`runs not finished: ${JSON.stringify(runs)}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

describe('createDiveRoutes', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let processing: Processing;
  let testApp: TestApp;
  let organisationId: string;
  let admin: Agent;
  let editor: Agent;
  let viewer: Agent;
  let base: string;
  let logId: string;
  let diveId: string;
  let log: ReturnType<typeof simulatedLog>;

  beforeAll(async () => {
    database = await createTestDatabase();
    processing = await startProcessing({
      databaseUrl: database.url,
      db: database.db,
      logger: pino({ level: 'silent' }),
      pollingIntervalS: 0.5,
    });
    testApp = await createTestApp(database, { processingQueue: processing.queue });
    ({ organisationId } = await seedOrganisation(database.db, 'Hollowtide Subsea', [
      { email: 'maren@hollowtide.example', role: 'admin' },
      { email: 'tomas@hollowtide.example', role: 'editor' },
      { email: 'ilse@hollowtide.example', role: 'viewer' },
    ]));
    admin = await signedInAgent(testApp, 'maren@hollowtide.example');
    editor = await signedInAgent(testApp, 'tomas@hollowtide.example');
    viewer = await signedInAgent(testApp, 'ilse@hollowtide.example');
    const project = await admin
      .post(`/api/v1/organisations/${organisationId}/projects`)
      .set(...SAME)
      .send({ name: 'Skarvfjord pipeline survey', timeZone: 'Europe/Oslo', auditProfile: 'inspection-rov' })
      .expect(201);
    base = `/api/v1/organisations/${organisationId}/projects/${project.body.project.id}`;
    log = simulatedLog(11);
    const uploaded = await editor
      .post(`${base}/logs`)
      .set(...SAME)
      .attach('files', Buffer.from(log.text), log.name)
      .expect(201);
    logId = uploaded.body.results[0].log.id;
  });
  afterAll(async () => {
    await processing?.stop();
    await testApp?.close();
    await database?.drop();
  });

  it('processes an upload in the background: the run ends done and the dive is listed with its summary', async () => {
    const runs = await waitForRuns(viewer, base, logId);
    expect(runs[0]).toMatchObject({ status: 'done', kind: 'process', auditProfile: 'inspection-rov', attempts: 1 });
    const list = await viewer.get(`${base}/dives`).expect(200);
    expect(list.body.total).toBeGreaterThanOrEqual(1);
    const dive = list.body.dives[0];
    diveId = dive.id;
    expect(dive).toMatchObject({ logId, diveNumber: 1, logFileName: log.name });
    expect(['pass', 'warn', 'fail']).toContain(dive.verdict);
    expect(dive.fixCount).toBeGreaterThan(1000);
    expect(dive.maxDepthM).toBeGreaterThan(0);
    expect(dive.bboxDeg).toHaveLength(4);
    const one = await viewer.get(`${base}/dives/${diveId}`).expect(200);
    expect(one.body.results).toHaveLength(1);
    expect(one.body.results[0].verdict).toBe(dive.verdict);
    expect(Array.isArray(one.body.findings)).toBe(true);
  });

  it('filters by time, box, verdict, depth and text, and pages with a total', async () => {
    const all = await viewer.get(`${base}/dives`).expect(200);
    const dive = all.body.dives[0];
    const [w, s, e, n] = dive.bboxDeg as [number, number, number, number];
    const count = async (query: string) => (await viewer.get(`${base}/dives?${query}`).expect(200)).body.total;
    expect(await count(`bbox=${w - 0.01},${s - 0.01},${e + 0.01},${n + 0.01}`)).toBe(all.body.total);
    expect(await count(`bbox=${e + 1},${s},${e + 2},${n}`)).toBe(0);
    expect(await count(`verdict=${dive.verdict}`)).toBe(all.body.total);
    expect(await count(`verdict=${['pass', 'warn', 'fail'].filter((v) => v !== dive.verdict).join(',')}`)).toBe(0);
    expect(await count(`minDepthM=${dive.maxDepthM + 1}`)).toBe(0);
    expect(await count(`maxDepthM=${dive.maxDepthM + 1}`)).toBe(all.body.total);
    expect(await count(`from=${encodeURIComponent(dive.endTime)}`)).toBe(all.body.total);
    expect(await count(`from=${encodeURIComponent(new Date(Date.parse(dive.endTime) + 1000).toISOString())}`)).toBe(0);
    expect(await count(`to=${encodeURIComponent(new Date(Date.parse(dive.startTime) - 1000).toISOString())}`)).toBe(0);
    const word = log.name.split(/[^A-Za-z0-9]+/).find((part) => /[A-Za-z]/.test(part) && part.length > 2) ?? 'vehicle';
    expect(await count(`q=${encodeURIComponent(word)}`)).toBe(all.body.total);
    expect(await count('q=nosuchwordanywhere')).toBe(0);
    const page = await viewer.get(`${base}/dives?limit=1&offset=5&sort=-maxDepth`).expect(200);
    expect(page.body).toMatchObject({ dives: [], total: all.body.total, limit: 1, offset: 5 });
    const bad = await viewer.get(`${base}/dives?bbox=1,2,3&verdict=grey`).expect(400);
    expect(bad.body.error.code).toBe('bad-request');
  });

  it('serves the track as GPX valid against the GPX 1.1 XSD, with a file name', async () => {
    const response = await viewer.get(`${base}/dives/${diveId}/track?format=gpx`).buffer(true).expect(200);
    expect(response.headers['content-type']).toMatch(/application\/gpx\+xml/);
    expect(response.headers['content-disposition']).toMatch(/^attachment; filename=".+-dive-01\.gpx"/);
    const dir = mkdtempSync(join(tmpdir(), 'leadline-dive-gpx-'));
    const path = join(dir, 'dive.gpx');
    writeFileSync(path, response.text);
    // The TopoGrafix GPX 1.1 schema with libxml2's xmllint (check-values.md §7); throws when invalid.
    execFileSync('/usr/bin/xmllint', ['--noout', '--schema', GPX_XSD, path], { stdio: 'pipe' });
    const dive = (await viewer.get(`${base}/dives/${diveId}`).expect(200)).body.dive;
    expect((response.text.match(/<trkpt /g) ?? []).length).toBeGreaterThanOrEqual(dive.fixCount);
  });

  it('serves GeoJSON, KML and CSV in a projected CRS that agrees with PROJ cs2cs', async () => {
    const dive = (await viewer.get(`${base}/dives/${diveId}`).expect(200)).body.dive;
    const geo = await viewer.get(`${base}/dives/${diveId}/track?format=geojson`).buffer(true).expect(200);
    const collection = JSON.parse(geo.text);
    expect(collection.type).toBe('FeatureCollection');
    const kml = await viewer.get(`${base}/dives/${diveId}/track?format=kml`).buffer(true).expect(200);
    expect(kml.text).toContain('<kml');
    expect(kml.headers['content-disposition']).toMatch(/\.kml"/);

    const csv = await viewer.get(`${base}/dives/${diveId}/track?format=csv&crs=EPSG:25832`).buffer(true).expect(200);
    const [header, first] = csv.text.split('\r\n');
    const columns = (header ?? '').split(',');
    const row = (first ?? '').split(',');
    const at = (name: string) => Number(row[columns.indexOf(name)]);
    expect(columns).toContain('easting_m');
    expect(csv.text.split('\r\n').filter((l) => l.startsWith(row[0] ?? '-')).length).toBeGreaterThanOrEqual(
      dive.fixCount,
    );
    // PROJ's cs2cs (EPSG:4326 takes latitude first) is the reference for the projection.
    const [eastingM, northingM] = execFileSync('/usr/bin/cs2cs', ['EPSG:4326', 'EPSG:25832', '-f', '%.4f'], {
      input: `${at('lat')} ${at('lon')}\n`,
    })
      .toString()
      .trim()
      .split(/\s+/)
      .map(Number);
    expect(Math.abs(at('easting_m') - (eastingM ?? Number.NaN))).toBeLessThan(0.002);
    expect(Math.abs(at('northing_m') - (northingM ?? Number.NaN))).toBeLessThan(0.002);

    const refused = await viewer.get(`${base}/dives/${diveId}/track?format=gpx&crs=EPSG:25832`).expect(422);
    expect(refused.body.error.message).toMatch(/CSV only/);
    await viewer.get(`${base}/dives/${diveId}/track?format=csv&crs=EPSG:1`).expect(422);
  });

  it('serves the cleaned (smoothed) track, and refuses the re-solved one without a setup', async () => {
    const raw = JSON.parse((await viewer.get(`${base}/dives/${diveId}/track?format=geojson`).buffer(true)).text);
    const cleaned = await viewer.get(`${base}/dives/${diveId}/track?format=geojson&variant=cleaned`).buffer(true);
    expect(cleaned.status).toBe(200);
    expect(cleaned.headers['content-disposition']).toMatch(/-cleaned\.geojson"/);
    const coordsOf = (fc: { features: Array<{ geometry: { type: string; coordinates: unknown } }> }) =>
      JSON.stringify(fc.features.find((f) => f.geometry.type.includes('LineString'))?.geometry.coordinates);
    expect(coordsOf(JSON.parse(cleaned.text))).not.toBe(coordsOf(raw));
    const refused = await viewer.get(`${base}/dives/${diveId}/track?variant=resolved`).expect(422);
    expect(refused.body.error.message).toMatch(/setup/);
  });

  it('serves the audit report as JSON, Markdown and HTML', async () => {
    const dive = (await viewer.get(`${base}/dives/${diveId}`).expect(200)).body.dive;
    const json = await viewer.get(`${base}/dives/${diveId}/report?format=json`).buffer(true).expect(200);
    const report = JSON.parse(json.text);
    expect(report).toMatchObject({
      schema: 'leadline/dive-report@1',
      verdict: dive.verdict,
      profile: 'inspection-rov',
    });
    expect(json.headers['content-disposition']).toMatch(/\.audit\.json"/);
    const md = await viewer.get(`${base}/dives/${diveId}/report?format=md`).buffer(true).expect(200);
    expect(md.text).toMatch(/^# /m);
    const html = await viewer.get(`${base}/dives/${diveId}/report?format=html`).buffer(true).expect(200);
    expect(html.text.toLowerCase()).toContain('<svg');
  });

  it('reprocesses a dive with another profile and the true setup, keeping the first run as history', async () => {
    await viewer
      .post(`${base}/dives/${diveId}/reprocess`)
      .set(...SAME)
      .send({})
      .expect(403);
    await editor
      .post(`${base}/dives/${diveId}/reprocess`)
      .set(...SAME)
      .send({ auditProfile: 'no-such-profile' })
      .expect(422);
    const queued = await editor
      .post(`${base}/dives/${diveId}/reprocess`)
      .set(...SAME)
      .send({ auditProfile: 'work-rov', setup: log.trueSetup })
      .expect(202);
    expect(queued.body.run).toMatchObject({ kind: 'reprocess', diveId, auditProfile: 'work-rov' });
    const runs = await waitForRuns(viewer, base, logId, 2);
    expect(runs.map((r) => r.status)).toEqual(['done', 'done']);
    const one = (await viewer.get(`${base}/dives/${diveId}`).expect(200)).body;
    expect(one.results).toHaveLength(2);
    expect(one.results[0]).toMatchObject({ auditProfile: 'work-rov' });
    expect(one.results[0].resolveComparison.resolvedCount).toBeGreaterThan(1000);
    expect(one.results[1]).toMatchObject({ auditProfile: 'inspection-rov', resolveSetup: null });
    expect(one.dive.latestResultId).toBe(one.results[0].id);
    expect(one.dive.auditProfile).toBe('work-rov');
    // The former run's report is still there, and the latest is the default.
    const former = await viewer.get(`${base}/dives/${diveId}/report?resultId=${one.results[1].id}`).buffer(true);
    expect(JSON.parse(former.text).profile).toBe('inspection-rov');
    const latest = await viewer.get(`${base}/dives/${diveId}/report`).buffer(true);
    expect(JSON.parse(latest.text).profile).toBe('work-rov');
    // The latest run's setup now serves the re-solved track.
    const resolved = await viewer.get(`${base}/dives/${diveId}/track?format=csv&variant=resolved`).buffer(true);
    expect(resolved.status).toBe(200);
    expect(resolved.headers['content-disposition']).toMatch(/-resolved\.csv"/);
  });

  it('says how far a re-solve moved the positions from the run before, as core measured them', async () => {
    const { results } = (await viewer.get(`${base}/dives/${diveId}`).expect(200)).body;
    const [resolvedRun, firstRun] = results as Array<{
      id: string;
      resolveComparison: { movedM: Record<string, number> } | null;
    }>;
    if (resolvedRun === undefined || firstRun === undefined) throw new Error('two results expected');
    const moved = await viewer.get(`${base}/dives/${diveId}/results/${resolvedRun.id}/displacement`).expect(200);
    expect(moved.body).toMatchObject({ resultId: resolvedRun.id, againstResultId: firstRun.id });
    // The run before audited the logged positions, so the distances must agree with core's own
    // logged-to-re-solved comparison stored with the re-solve (an independent path through resolveTrack).
    const core = resolvedRun.resolveComparison?.movedM ?? {};
    expect(moved.body.comparedCount).toBe(core.comparedCount);
    expect(moved.body.comparedCount).toBeGreaterThan(1000);
    for (const key of ['medianM', 'p95M', 'maxM', 'meanM', 'rmsM'])
      expect(Math.abs(moved.body[key] - (core[key] ?? Number.NaN))).toBeLessThan(1e-6);
    // The simulated log was written with a wrong setup, so the true one moves every position somewhat.
    expect(moved.body.medianM).toBeGreaterThan(0);
    expect(moved.body.maxM).toBeGreaterThan(moved.body.medianM);
    // Compared the other way round the distances are the same; against itself nothing moved.
    const back = await viewer
      .get(`${base}/dives/${diveId}/results/${firstRun.id}/displacement?against=${resolvedRun.id}`)
      .expect(200);
    expect(back.body.maxM).toBeCloseTo(moved.body.maxM, 9);
    const itself = await viewer
      .get(`${base}/dives/${diveId}/results/${resolvedRun.id}/displacement?against=${resolvedRun.id}`)
      .expect(200);
    expect(itself.body).toMatchObject({ medianM: 0, maxM: 0 });
    // The first run has nothing before it; an unknown result is not found.
    const none = await viewer.get(`${base}/dives/${diveId}/results/${firstRun.id}/displacement`).expect(404);
    expect(none.body.error.message).toMatch(/first run/);
    await viewer.get(`${base}/dives/${diveId}/results/${randomUUID()}/displacement`).expect(404);
    await viewer.get(`${base}/dives/${diveId}/results/${firstRun.id}/displacement?against=nope`).expect(400);
  });

  it("serves the web's dive view to members only, with columns as long as the audited track", async () => {
    const view = (await viewer.get(`/api/v1/dives/${diveId}`).expect(200)).body;
    const n = view.fixes.timeMs.length;
    expect(n).toBeGreaterThan(1000);
    for (const name of ['latDeg', 'lonDeg', 'depthM', 'severity']) expect(view.fixes[name]).toHaveLength(n);
    expect(view).toMatchObject({
      id: diveId,
      logFileName: log.name,
      projectName: 'Skarvfjord pipeline survey',
      organisationId,
      logId,
    });
    expect(view.resultId).toMatch(/^[0-9a-f-]{36}$/);
    expect(view.summary.fixCount).toBe(n);
    expect(view.s44.map((s: { order: string }) => s.order)).toEqual(['exclusive', 'special', '1a', '1b', '2']);
    for (const f of view.findings) expect(f.endIndex).toBeLessThan(n);
    await seedOrganisation(database.db, 'Brinewater Diving', [{ email: 'odile@brinewater.example', role: 'admin' }]);
    const outsider = await signedInAgent(testApp, 'odile@brinewater.example');
    await outsider.get(`/api/v1/dives/${diveId}`).expect(404);
  });

  it('reprocesses a whole log as one more run', async () => {
    await editor
      .post(`${base}/logs/${logId}/reprocess`)
      .set(...SAME)
      .send({ auditProfile: 'diver' })
      .expect(202);
    const runs = await waitForRuns(viewer, base, logId, 3);
    expect(runs[0]).toMatchObject({ status: 'done', kind: 'reprocess', auditProfile: 'diver', diveId: null });
    const dive = (await viewer.get(`${base}/dives/${diveId}`).expect(200)).body;
    expect(dive.results).toHaveLength(3);
    expect(dive.dive.auditProfile).toBe('diver');
  });

  it('fails a run it cannot do with the reason, and keeps the log', async () => {
    const other = await admin
      .post(`/api/v1/organisations/${organisationId}/projects`)
      .set(...SAME)
      .send({ name: 'Sled trials', auditProfile: 'custom-sled' })
      .expect(201);
    const otherBase = `/api/v1/organisations/${organisationId}/projects/${other.body.project.id}`;
    const uploaded = await editor
      .post(`${otherBase}/logs`)
      .set(...SAME)
      .attach('files', Buffer.from(log.text), log.name)
      .expect(201);
    const otherLogId = uploaded.body.results[0].log.id;
    const [run] = await waitForRuns(viewer, otherBase, otherLogId);
    expect(run).toMatchObject({ status: 'failed' });
    expect(run?.reason).toMatch(/unknown profile "custom-sled"/);
    const original = await viewer.get(`${otherBase}/logs/${otherLogId}/original`).buffer(true).expect(200);
    expect(createHash('sha256').update(original.body).digest('hex')).toBe(
      createHash('sha256').update(log.text).digest('hex'),
    );
    // Reprocessing the failed log with a known profile reads and splits it again.
    const again = await editor
      .post(`${otherBase}/logs/${otherLogId}/reprocess`)
      .set(...SAME)
      .send({ auditProfile: 'work-rov' })
      .expect(202);
    expect(again.body.run).toMatchObject({ kind: 'process', auditProfile: 'work-rov' });
    const runs = await waitForRuns(viewer, otherBase, otherLogId, 2);
    expect(runs.map((r) => r.status)).toEqual(['done', 'failed']);
    const dives = await viewer.get(`${otherBase}/dives?logId=${otherLogId}`).expect(200);
    expect(dives.body.total).toBeGreaterThanOrEqual(1);
  });

  it('sorts and pages over several dives', async () => {
    const second = simulatedLog(12);
    const uploaded = await editor
      .post(`${base}/logs`)
      .set(...SAME)
      .attach('files', Buffer.from(second.text), second.name)
      .expect(201);
    await waitForRuns(viewer, base, uploaded.body.results[0].log.id);
    const all = (await viewer.get(`${base}/dives?sort=maxDepth`).expect(200)).body;
    expect(all.total).toBeGreaterThanOrEqual(2);
    const depths = all.dives.map((d: { maxDepthM: number }) => d.maxDepthM);
    expect(depths).toEqual([...depths].sort((a, b) => a - b));
    const descending = (await viewer.get(`${base}/dives?sort=-maxDepth`).expect(200)).body.dives;
    expect(descending.map((d: { id: string }) => d.id)).toEqual(all.dives.map((d: { id: string }) => d.id).reverse());
    const starts = (await viewer.get(`${base}/dives?sort=startTime`).expect(200)).body.dives.map(
      (d: { startTime: string }) => Date.parse(d.startTime),
    );
    expect(starts).toEqual([...starts].sort((a, b) => a - b));
    const first = (await viewer.get(`${base}/dives?sort=startTime&limit=1`).expect(200)).body;
    const next = (await viewer.get(`${base}/dives?sort=startTime&limit=1&offset=1`).expect(200)).body;
    expect(first.total).toBe(all.total);
    expect(next.dives[0].id).not.toBe(first.dives[0].id);
    expect(Date.parse(next.dives[0].startTime)).toBeGreaterThanOrEqual(Date.parse(first.dives[0].startTime));
  });

  it("lists the dives of every project of the organisation, newest first, filtered like a project's list", async () => {
    const orgDives = `/api/v1/organisations/${organisationId}/dives`;
    const projects = (await viewer.get(`/api/v1/organisations/${organisationId}/projects`).expect(200)).body.projects;
    const projectIds = new Set(projects.map((p: { id: string }) => p.id));
    const sumOverProjects = async (query: string) => {
      let sum = 0;
      for (const id of projectIds)
        sum += (await viewer.get(`/api/v1/organisations/${organisationId}/projects/${id}/dives?${query}`).expect(200))
          .body.total;
      return sum;
    };
    const all = await viewer.get(`${orgDives}?limit=100`).expect(200);
    expect(all.body.total).toBeGreaterThan(1);
    expect(all.body.total).toBe(await sumOverProjects(''));
    const starts = all.body.dives.map((d: { startTime: string }) => Date.parse(d.startTime));
    expect(starts).toEqual([...starts].sort((a, b) => b - a));
    for (const dive of all.body.dives) expect(projectIds.has(dive.projectId)).toBe(true);
    const attention = await viewer.get(`${orgDives}?verdict=warn,fail&limit=100`).expect(200);
    expect(attention.body.total).toBe(await sumOverProjects('verdict=warn,fail'));
    for (const dive of attention.body.dives) expect(['warn', 'fail']).toContain(dive.verdict);
    const paged = await viewer.get(`${orgDives}?limit=1&offset=1`).expect(200);
    expect(paged.body.dives.map((d: { id: string }) => d.id)).toEqual([all.body.dives[1].id]);
    const tooMany = await viewer.get(`${orgDives}?limit=101`).expect(400);
    expect(tooMany.body.error.code).toBe('bad-request');
    // Another organisation sees none of these dives through its own address.
    const { organisationId: otherId } = await seedOrganisation(database.db, 'Brinewater Diving', [
      { email: 'odile@brinewater.example', role: 'viewer' },
    ]);
    const other = await signedInAgent(testApp, 'odile@brinewater.example');
    expect((await other.get(`/api/v1/organisations/${otherId}/dives`).expect(200)).body.total).toBe(0);
    await other.get(orgDives).expect(403);
  });

  it('streams the selected dives as one zip of track files', async () => {
    const response = await viewer
      .get(`${base}/dive-archive?format=geojson&ids=${diveId}`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(response.headers['content-type']).toBe('application/zip');
    const zip = response.body as Buffer;
    // A zip starts with a local file header "PK\x03\x04" and ends with the end-of-central-directory record.
    expect(zip.subarray(0, 4).toString('latin1')).toBe('PK\x03\x04');
    expect(zip.includes(Buffer.from('PK\x05\x06', 'latin1'))).toBe(true);
    expect(zip.includes(Buffer.from('-dive-01.geojson'))).toBe(true);
    await viewer.get(`${base}/dive-archive?q=nosuchwordanywhere`).expect(404);
  });

  it('writes the zip as CSV in a chosen CRS, or UTM zoned from the data, with a notes file; refuses a bad CRS before streaming', async () => {
    const zipOf = (query: string) =>
      viewer
        .get(`${base}/dive-archive?${query}`)
        .buffer(true)
        .parse((res, done) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => done(null, Buffer.concat(chunks)));
        });
    // unzip (Info-ZIP) reads the archive: an outside check that the streamed zip is whole.
    const saved = (zip: Buffer) => {
      const file = join(mkdtempSync(join(tmpdir(), 'leadline-zip-')), 'dives.zip');
      writeFileSync(file, zip);
      return file;
    };
    const listing = (zip: Buffer) => execFileSync('unzip', ['-Z1', saved(zip)]).toString();
    const entry = (zip: Buffer, name: string) => execFileSync('unzip', ['-p', saved(zip), name]).toString();
    for (const crs of ['EPSG:25832', 'utm']) {
      const response = await zipOf(`format=csv&crs=${crs}&ids=${diveId}`).expect(200);
      const zip = response.body as Buffer;
      const names = listing(zip).trim().split('\n');
      expect(names).toContain('crs-notes.txt');
      const csvName = names.find((n) => n.endsWith('.csv'));
      expect(csvName).toBeDefined();
      const notes = entry(zip, 'crs-notes.txt');
      expect(notes).toContain(`${csvName}: `);
      if (crs === 'utm') expect(notes).toMatch(/UTM zone \d+/i);
      else expect(notes).toContain('EPSG:25832');
      // The CSV carries projected columns besides latitude and longitude.
      const header = entry(zip, csvName ?? '').split('\n')[0] ?? '';
      expect(header).toMatch(/lat/i);
      expect(header.split(',').length).toBeGreaterThan(4);
    }
    const wrongFormat = await viewer.get(`${base}/dive-archive?format=gpx&crs=EPSG:25832&ids=${diveId}`).expect(422);
    expect(wrongFormat.headers['content-type']).toMatch(/json/);
    expect(wrongFormat.body.error.message).toMatch(/CSV only/);
    const unknown = await viewer.get(`${base}/dive-archive?format=csv&crs=EPSG:999999&ids=${diveId}`).expect(422);
    expect(unknown.body.error.details).toEqual({ field: 'crs' });
  });
});

describe('createConvertRoutes', () => {
  let database: Awaited<ReturnType<typeof createTestDatabase>>;
  let testApp: TestApp;
  let editor: Agent;

  beforeAll(async () => {
    database = await createTestDatabase();
    testApp = await createTestApp(database);
    await seedOrganisation(database.db, 'Hollowtide Subsea', [{ email: 'tomas@hollowtide.example', role: 'editor' }]);
    editor = await signedInAgent(testApp, 'tomas@hollowtide.example');
  });
  afterAll(async () => {
    await testApp?.close();
    await database?.drop();
  });

  it('converts a file and stores nothing', async () => {
    const content = readFileSync(join(READ_FIXTURES, 'gpx-1.1-two-tracks.gpx'));
    const response = await editor
      .post('/api/v1/convert?to=geojson')
      .set(...SAME)
      .attach('file', content, 'gpx-1.1-two-tracks.gpx')
      .buffer(true)
      .expect(200);
    expect(response.headers['content-disposition']).toMatch(/filename="gpx-1\.1-two-tracks\.geojson"/);
    expect(JSON.parse(response.text).type).toBe('FeatureCollection');
    expect(Number(response.headers['x-leadline-fix-count'])).toBeGreaterThan(0);
    const [row] = await database.db('logs').count<{ count: string }[]>({ count: '*' });
    expect(Number(row?.count)).toBe(0);
  });

  it('answers an unreadable file, a missing file and a bad target with 4xx and a message', async () => {
    const garbage = readFileSync(join(READ_FIXTURES, 'binary-garbage.bin'));
    const refused = await editor
      .post('/api/v1/convert?to=gpx')
      .set(...SAME)
      .attach('file', garbage, 'binary-garbage.bin')
      .expect(422);
    expect(refused.body.error.message).toMatch(/binary/i);
    await editor
      .post('/api/v1/convert?to=gpx')
      .set(...SAME)
      .expect(400);
    await editor
      .post('/api/v1/convert?to=shapefile')
      .set(...SAME)
      .expect(400);
  });
});
