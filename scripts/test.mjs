// @ts-check
// `npm test`: install what is missing, start a throwaway PostgreSQL (never npm start's data), then run
// every suite: lint, typecheck, web build, unit, golden, PostgreSQL-backed and browser tests.
// Ends with one plain line "N passed, N failed" counting every suite; exits non-zero on any failure.
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { runMain, SetupError, say } from './lib/console.mjs';
import { ensureDebianPackages, ensureNodeModules } from './lib/dependencies.mjs';
import { databaseUrl, ensureDatabase, ensurePostgres, findFreePort, startCluster } from './lib/postgres.mjs';
import { run } from './lib/processes.mjs';
import { runTypecheck, TYPECHECK_PROJECTS } from './lib/typecheck.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
const artifacts = join(root, '.test-artifacts');
const vitestArgs = process.argv.slice(2);

/** Tools the suites use beside npm packages: the browser, and the reference programs the geodesy checks compare with. */
const DEBIAN_TOOLS = [
  { pkg: 'chromium', provides: '/usr/bin/chromium' },
  { pkg: 'proj-bin', provides: '/usr/bin/cs2cs' },
  { pkg: 'geographiclib-tools', provides: '/usr/bin/GeodSolve' },
  { pkg: 'libxml2-utils', provides: '/usr/bin/xmllint' },
];

let passed = 0;
let failed = 0;
/** @param {string} name @param {boolean} ok */
function count(name, ok) {
  if (ok) passed++;
  else {
    failed++;
    say(`FAILED: ${name}`);
  }
}

await runMain(async () => {
  await ensureNodeModules(root);
  try {
    await ensureDebianPackages(DEBIAN_TOOLS, 'the browser and reference-tool tests');
  } catch (error) {
    // The suites still run; the tests that need a missing tool fail and name it.
    if (error instanceof SetupError) say(error.message);
    else throw error;
  }

  const bin = await ensurePostgres();
  const dataDir = mkdtempSync(join(tmpdir(), 'leadline-test-pg-'));
  const cluster = await startCluster({ bin, dataDir, port: await findFreePort(), throwaway: true });
  const stopOnSignal = () => {
    void cluster.stop().finally(() => process.exit(130));
  };
  process.once('SIGINT', stopOnSignal);
  process.once('SIGTERM', stopOnSignal);
  try {
    await ensureDatabase({ bin, port: cluster.port, name: 'leadline_test' });
    const env = { ...process.env, DATABASE_URL: databaseUrl(cluster.port, 'leadline_test'), NODE_ENV: 'test' };
    say(`test PostgreSQL on 127.0.0.1:${cluster.port} (throwaway, ${dataDir})`);

    const migrate = await run(process.execPath, ['--import', 'tsx', 'scripts/migrate.ts'], { cwd: root, env });
    count('migrations', migrate.code === 0);

    say('lint (biome check)');
    const lint = await run(process.execPath, ['node_modules/@biomejs/biome/bin/biome', 'check', '.'], { cwd: root });
    count('lint', lint.code === 0);

    for (const project of TYPECHECK_PROJECTS) {
      const { ok } = await runTypecheck(root, project);
      count(`typecheck ${project}`, ok);
    }

    say('building the web site for the browser tests');
    const build = await run(process.execPath, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn'], {
      cwd: root,
    });
    count('web build', build.code === 0);

    mkdirSync(artifacts, { recursive: true });
    const report = join(artifacts, 'vitest.json');
    rmSync(report, { force: true });
    const vitest = await run(
      process.execPath,
      [
        'node_modules/vitest/vitest.mjs',
        'run',
        '--reporter=default',
        '--reporter=json',
        `--outputFile.json=${report}`,
        ...vitestArgs,
      ],
      { cwd: root, env },
    );
    if (existsSync(report)) {
      const result = JSON.parse(readFileSync(report, 'utf8'));
      passed += result.numPassedTests;
      failed += result.numFailedTests;
      // A test file that fails to load has no tests to count; count it as one failure.
      const brokenFiles = result.testResults.filter(
        (/** @type {{ status: string, assertionResults: unknown[] }} */ file) =>
          file.status === 'failed' && file.assertionResults.length === 0,
      ).length;
      failed += brokenFiles;
      if (vitest.code !== 0 && result.numFailedTests === 0 && brokenFiles === 0) count('vitest run', false);
    } else {
      count('vitest run (no report written)', false);
    }
  } finally {
    await cluster.stop();
  }
});

if (process.exitCode && failed === 0) failed = 1;
process.stdout.write(`${passed} passed, ${failed} failed\n`);
process.exitCode = failed === 0 ? 0 : 1;
