// The command line runs as two prebuilt bundles, dist/leadline.mjs and dist/worker.mjs (its worker
// threads' entry), made by esbuild from the TypeScript sources of this package and of @leadline/core.
// A bundle starts in a fraction of the time tsx needs to compile the sources on the fly, and every
// worker thread would pay that compile again. The bundles are rebuilt (in well under a second)
// whenever a source is newer, so an edited source is never run stale. Third-party packages are
// bundled too (loading dozens of CommonJS packages one by one costs more than our own code), except
// the few that find files of their own at run time (OUTSIDE).
import { mkdirSync, readdirSync, renameSync, rmSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const CLI_ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const CORE_ROOT = join(CLI_ROOT, '..', 'core');
const DIST = join(CLI_ROOT, 'dist');
const ENTRIES = { leadline: join(CLI_ROOT, 'src', 'main.ts'), worker: join(CLI_ROOT, 'src', 'worker-entry.ts') };
/** What the bundles are made from: sources, package manifests, and this script. */
const INPUTS = [
  join(CLI_ROOT, 'src'),
  join(CORE_ROOT, 'src'),
  join(CLI_ROOT, 'package.json'),
  join(CORE_ROOT, 'package.json'),
  fileURLToPath(import.meta.url),
];

function newestInput() {
  let newest = 0;
  for (const input of INPUTS) {
    const stat = statSync(input);
    if (!stat.isDirectory()) newest = Math.max(newest, stat.mtimeMs);
    else
      for (const name of readdirSync(input, { recursive: true }))
        newest = Math.max(newest, statSync(join(input, name)).mtimeMs);
  }
  return newest;
}

function builtAt() {
  let oldest = Number.POSITIVE_INFINITY;
  for (const name of Object.keys(ENTRIES)) {
    const stat = statSync(join(DIST, `${name}.mjs`), { throwIfNoEntry: false });
    if (stat === undefined) return 0;
    oldest = Math.min(oldest, stat.mtimeMs);
  }
  return oldest;
}

/** Builds both bundles into a private folder, then moves them in place (a rename is atomic). */
export async function buildBundles() {
  const { build } = await import('esbuild');
  const staging = join(DIST, `.build-${process.pid}`);
  mkdirSync(staging, { recursive: true });
  try {
    await build({
      entryPoints: ENTRIES,
      outdir: staging,
      outExtension: { '.js': '.mjs' },
      bundle: true,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      sourcemap: 'linked',
      logLevel: 'error',
      external: OUTSIDE,
      // Bundled CommonJS packages call require() for Node's built-in modules.
      banner: {
        js: "import { createRequire as __leadlineRequire } from 'node:module'; const require = __leadlineRequire(import.meta.url);",
      },
    });
    // The worker first: a command starting meanwhile never finds a new main with an old worker.
    for (const name of ['worker', 'leadline']) {
      renameSync(join(staging, `${name}.mjs.map`), join(DIST, `${name}.mjs.map`));
      renameSync(join(staging, `${name}.mjs`), join(DIST, `${name}.mjs`));
    }
  } finally {
    rmSync(staging, { recursive: true, force: true });
  }
}

/**
 * Packages loaded from node_modules at run time: piscina starts its own worker script, xmllint-wasm
 * loads its WebAssembly file, epsg-index is read record by record on demand, and the build tools.
 */
const OUTSIDE = ['piscina', 'xmllint-wasm', 'epsg-index', 'esbuild', 'tsx'];

/** The URL of the main bundle, rebuilt first when any source is newer than it. */
export async function ensureBundles() {
  if (builtAt() < newestInput()) await buildBundles();
  return pathToFileURL(join(DIST, 'leadline.mjs')).href;
}
