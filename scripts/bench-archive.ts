// The archive's figures (issue 9): a 7,200-fix dive uploaded, processed in the background and
// queryable; its stored fixes read back; its GeoJSON track served over loopback HTTP.
// Runs against DATABASE_URL when set, else against a throwaway PostgreSQL it starts and stops.
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { Session } from 'node:inspector/promises';
import { createRequire } from 'node:module';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import knex from 'knex';
import pino from 'pino';
import { MIGRATIONS_DIRECTORY } from '../knexfile.js';
import { planSeason, simulatePlannedDive } from '../packages/core/src/index.js';
import { startProcessing } from '../packages/server/src/jobs/start-processing.js';
import { createKnexDiveStore } from '../packages/server/src/stores/dive-store.js';
import { createTestApp, seedOrganisation, signedInAgent } from '../packages/server/src/testing/create-test-app.js';

/** The helpers of scripts/lib/postgres.mjs that start a throwaway cluster (plain JavaScript). */
interface PostgresHelpers {
  ensurePostgres(): Promise<string>;
  findFreePort(): Promise<number>;
  startCluster(o: { bin: string; dataDir: string; port: number; throwaway: boolean }): Promise<{
    port: number;
    stop: () => Promise<void>;
  }>;
  ensureDatabase(o: { bin: string; port: number; name: string }): Promise<void>;
  databaseUrl(port: number, name: string): string;
}
const POSTGRES_HELPERS = './lib/postgres.mjs';

function percentile(values: number[], q: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)] ?? Number.NaN;
}

/** Polls a log's runs every 5 ms until its latest is done; throws when it failed. */
async function waitForRun(
  runsUrl: string,
  headers: Record<string, string>,
): Promise<{ createdAt: string; startedAt: string; finishedAt: string }> {
  for (;;) {
    const runs = (await (await fetch(runsUrl, { headers })).json()) as {
      runs: Array<{ status: string; createdAt: string; startedAt: string; finishedAt: string }>;
    };
    const run = runs.runs[0];
    if (run?.status === 'failed') throw new Error('processing failed');
    if (run?.status === 'done') return run;
    await new Promise((resolve) => setTimeout(resolve, 5));
  }
}

/** What autocannon measured, and the CPU the server's process spent meanwhile. */
interface LoadFigures {
  /** CPU time (user + system, all threads) of this process per request: the load-independent cost. */
  cpuMsPerRequest: number;
  requestsPerS: number;
  p50Ms: number;
  p99Ms: number;
  requests: number;
  /** Errors, timeouts and 4xx/5xx answers. */
  failures: number;
  notModified: number;
  bytesPerRequest: number;
}

/**
 * GETs `url` with autocannon in a child process (its own CPU, not the server's event loop) and reads
 * its JSON summary. Loopback only; the run ends by itself after `seconds`.
 */
async function runAutocannon(
  url: string,
  headers: Record<string, string>,
  options: { connections: number; seconds: number },
): Promise<LoadFigures> {
  const cli = createRequire(import.meta.url).resolve('autocannon/autocannon.js');
  const args = [cli, '--json', '-c', String(options.connections), '-d', String(options.seconds)];
  for (const [name, value] of Object.entries(headers)) args.push('-H', `${name}=${value}`);
  args.push(url);
  const cpu0 = process.cpuUsage();
  const child = spawn(process.execPath, args, { stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  let err = '';
  child.stdout.on('data', (chunk: Buffer) => {
    out += chunk.toString();
  });
  child.stderr.on('data', (chunk: Buffer) => {
    err += chunk.toString();
  });
  const code = await new Promise<number | null>((resolve) => child.on('close', resolve));
  const cpu = process.cpuUsage(cpu0);
  if (code !== 0) throw new Error(`autocannon exited ${code}: ${err.trim()}`);
  const result = JSON.parse(out) as {
    requests: { average: number; total: number };
    latency: { p50: number; p99: number };
    throughput: { total: number };
    errors: number;
    timeouts: number;
    '3xx': number;
    '4xx': number;
    '5xx': number;
  };
  return {
    cpuMsPerRequest: result.requests.total === 0 ? Number.NaN : (cpu.user + cpu.system) / 1000 / result.requests.total,
    requestsPerS: result.requests.average,
    p50Ms: result.latency.p50,
    p99Ms: result.latency.p99,
    requests: result.requests.total,
    failures: result.errors + result.timeouts + result['4xx'] + result['5xx'],
    notModified: result['3xx'],
    bytesPerRequest: result.requests.total === 0 ? 0 : result.throughput.total / result.requests.total,
  };
}

/** Runs the archive benchmark and returns one line of figures. */
export async function runArchiveBench(): Promise<string> {
  let stopCluster = async () => {};
  let dataDir: string | undefined;
  let url = process.env.DATABASE_URL;
  if (url === undefined) {
    const { databaseUrl, ensureDatabase, ensurePostgres, findFreePort, startCluster } = (await import(
      POSTGRES_HELPERS
    )) as PostgresHelpers;
    const bin = await ensurePostgres();
    dataDir = mkdtempSync(join(tmpdir(), 'leadline-bench-pg-'));
    const cluster = await startCluster({ bin, dataDir, port: await findFreePort(), throwaway: true });
    stopCluster = cluster.stop;
    await ensureDatabase({ bin, port: cluster.port, name: 'leadline_bench' });
    url = databaseUrl(cluster.port, 'leadline_bench');
  }
  const connection: string = url;
  const db = knex({ client: 'pg', connection, pool: { min: 0, max: 10 } });
  try {
    await db.migrate.latest({ directory: MIGRATIONS_DIRECTORY, loadExtensions: ['.ts'] });
    const processing = await startProcessing({
      databaseUrl: connection,
      db,
      logger: pino({ level: 'silent' }),
      pollingIntervalS: 0.5,
    });
    await processing.ready(); // the worker thread has loaded the code: the first upload is timed like the rest
    const testApp = await createTestApp({ db, url: connection }, { processingQueue: processing.queue });
    const { organisationId } = await seedOrganisation(db, `Hollowtide bench ${Date.now()}`, [
      { email: 'bench@hollowtide.example', role: 'admin' },
    ]);
    const agent = await signedInAgent(testApp, 'bench@hollowtide.example');
    const same = ['Sec-Fetch-Site', 'same-origin'] as const;
    const project = await agent
      .post(`/api/v1/organisations/${organisationId}/projects`)
      .set(...same)
      .send({ name: `Bench ${Date.now()}` });
    const token = await agent
      .post(`/api/v1/organisations/${organisationId}/tokens`)
      .set(...same)
      .send({ name: 'bench', scope: 'read-write', expiresInDays: 1 });
    const server = testApp.app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    const port = (server.address() as AddressInfo).port;
    const base = `http://127.0.0.1:${port}/api/v1/organisations/${organisationId}/projects/${project.body.project.id}`;
    const headers = { authorization: `Bearer ${token.body.token}` };

    // 120-minute dives at 1 Hz: 7,200 fixes each, distinct bytes per seed (simulated before timing).
    // The first uploads after start pay for compiling the processing code (JIT) on its thread; they
    // are timed and reported apart, and the 20 measured uploads follow them (the steady state).
    const warmUps = 3;
    const uploads = 20;
    const season = planSeason({ seed: 7207, dives: warmUps + uploads, diveMinutes: 120, dialect: 'csv' });
    const logs = season.map((planned) => {
      const [file] = simulatePlannedDive(planned).files;
      if (file === undefined) throw new Error('no file');
      return { name: file.name.split('/').pop() ?? file.name, text: file.text };
    });
    const endToEnd: number[] = [];
    const workMs: number[] = [];
    const uploadMs: number[] = [];
    const waitMs: number[] = [];
    let diveId = '';
    let fixCount = 0;
    const warmUpMs: number[] = [];
    for (const [index, log] of logs.entries()) {
      const t0 = performance.now();
      const form = new FormData();
      form.append('files', new Blob([log.text]), log.name);
      const uploaded = (await (await fetch(`${base}/logs`, { method: 'POST', body: form, headers })).json()) as {
        results: Array<{ log: { id: string } }>;
      };
      const logId = uploaded.results[0]?.log.id ?? '';
      uploadMs.push(performance.now() - t0);
      const run = await waitForRun(`${base}/logs/${logId}/runs`, headers);
      const list = (await (await fetch(`${base}/dives?logId=${logId}`, { headers })).json()) as {
        dives: Array<{ id: string; fixCount: number }>;
      };
      if (index < warmUps) {
        warmUpMs.push(performance.now() - t0);
        continue;
      }
      endToEnd.push(performance.now() - t0);
      workMs.push(Date.parse(run.finishedAt) - Date.parse(run.startedAt));
      waitMs.push(Date.parse(run.startedAt) - Date.parse(run.createdAt));
      diveId = list.dives[0]?.id ?? '';
      fixCount = list.dives[0]?.fixCount ?? 0;
    }

    // One dive's fixes from the database: one indexed read of one row.
    const dives = createKnexDiveStore(db);
    const readMs: number[] = [];
    for (let i = 0; i < 30; i++) {
      const t0 = performance.now();
      await dives.tracks(diveId);
      readMs.push(performance.now() - t0);
    }

    // GET of its GeoJSON track: one client, one request at a time, after a first request fills the cache.
    const trackUrl = `${base}/dives/${diveId}/track?format=geojson`;
    const sequential: number[] = [];
    for (let i = 0; i < 41; i++) {
      const t0 = performance.now();
      await (await fetch(trackUrl, { headers })).arrayBuffer();
      if (i > 0) sequential.push(performance.now() - t0);
    }

    // GET of its GeoJSON track: autocannon in its own process (the load must not share the server's
    // event loop), 10 connections on loopback for 10 s.
    // As browsers ask (gzip accepted), as a plain client asks (identity), and revalidating a copy held (304).
    const gzipped = { ...headers, 'accept-encoding': 'gzip' };
    // LEADLINE_BENCH_PROFILE=<folder> writes a CPU profile of the server during this run (track-get.cpuprofile).
    const profileDir = process.env.LEADLINE_BENCH_PROFILE;
    const profiler = profileDir === undefined ? undefined : new Session();
    profiler?.connect();
    await profiler?.post('Profiler.enable');
    await profiler?.post('Profiler.start');
    const steady = await runAutocannon(trackUrl, gzipped, { connections: 10, seconds: 10 });
    if (profiler !== undefined && profileDir !== undefined) {
      const { profile } = await profiler.post('Profiler.stop');
      writeFileSync(join(profileDir, 'track-get.cpuprofile'), JSON.stringify(profile));
      profiler.disconnect();
    }
    const identity = await runAutocannon(trackUrl, headers, { connections: 10, seconds: 10 });
    const held = await fetch(trackUrl, { headers: gzipped });
    await held.arrayBuffer();
    const revalidate = await runAutocannon(
      trackUrl,
      { ...gzipped, 'if-none-match': held.headers.get('etag') ?? '' },
      { connections: 10, seconds: 5 },
    );

    // The same while the worker processes uploads: does a busy queue stall the API?
    const busyLogs = planSeason({ seed: 7208, dives: 4, diveMinutes: 120, dialect: 'csv' }).map((planned) => {
      const [file] = simulatePlannedDive(planned).files;
      if (file === undefined) throw new Error('no file');
      return { name: file.name.split('/').pop() ?? file.name, text: file.text };
    });
    const busyIds: string[] = [];
    for (const log of busyLogs) {
      const form = new FormData();
      form.append('files', new Blob([log.text]), log.name);
      const uploaded = (await (await fetch(`${base}/logs`, { method: 'POST', body: form, headers })).json()) as {
        results: Array<{ log: { id: string } }>;
      };
      busyIds.push(uploaded.results[0]?.log.id ?? '');
    }
    const busy = await runAutocannon(trackUrl, gzipped, { connections: 10, seconds: 5 });
    for (const logId of busyIds) await waitForRun(`${base}/logs/${logId}/runs`, headers);
    server.close();
    await processing.stop();
    await testApp.close();
    const f = (x: number) => x.toFixed(0);
    return [
      `${uploads} uploads of a ${fixCount}-fix dive after ${warmUps} warm-up uploads (${warmUpMs.map(f).join(', ')} ms), upload → processed → listed: p50 ${f(percentile(endToEnd, 0.5))} ms, p95 ${f(percentile(endToEnd, 0.95))} ms`,
      `the upload request alone (archive, then queue): p50 ${f(percentile(uploadMs, 0.5))} ms`,
      `queued → taken by the worker: p50 ${f(percentile(waitMs, 0.5))} ms`,
      `processing run alone (read, split, audit, summarise, store): p50 ${f(percentile(workMs, 0.5))} ms, p95 ${f(percentile(workMs, 0.95))} ms`,
      `stored fixes read back: p50 ${percentile(readMs, 0.5).toFixed(1)} ms`,
      `GET GeoJSON track one at a time: p50 ${f(percentile(sequential, 0.5))} ms`,
      `GET GeoJSON track, gzip accepted (${(steady.bytesPerRequest / 1024).toFixed(0)} KiB sent), autocannon 10 connections 10 s: ${f(steady.requestsPerS)} req/s, p50 ${f(steady.p50Ms)} ms, p99 ${f(steady.p99Ms)} ms (${steady.requests} requests, ${steady.failures} failed), server CPU ${steady.cpuMsPerRequest.toFixed(2)} ms per request`,
      `the same uncompressed (${(identity.bytesPerRequest / 1024).toFixed(0)} KiB): ${f(identity.requestsPerS)} req/s, p50 ${f(identity.p50Ms)} ms, p99 ${f(identity.p99Ms)} ms (${identity.failures} failed), server CPU ${identity.cpuMsPerRequest.toFixed(2)} ms per request`,
      `revalidating with If-None-Match (304), 5 s: ${f(revalidate.requestsPerS)} req/s, p50 ${f(revalidate.p50Ms)} ms, p99 ${f(revalidate.p99Ms)} ms (${revalidate.notModified} of ${revalidate.requests} answered 304), server CPU ${revalidate.cpuMsPerRequest.toFixed(2)} ms per request`,
      `gzip accepted while 4 uploads are processed, 5 s: ${f(busy.requestsPerS)} req/s, p50 ${f(busy.p50Ms)} ms, p99 ${f(busy.p99Ms)} ms (${busy.failures} failed)`,
    ].join('; ');
  } finally {
    await db.destroy();
    await stopCluster();
    if (dataDir !== undefined) rmSync(dataDir, { recursive: true, force: true });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) process.stdout.write(`${await runArchiveBench()}\n`);
