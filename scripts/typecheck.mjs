// @ts-check
// `npm run typecheck`: strict tsc over the top level and every package; one line per project.
import { fileURLToPath } from 'node:url';
import { runTypecheck, TYPECHECK_PROJECTS } from './lib/typecheck.mjs';

const root = fileURLToPath(new URL('..', import.meta.url));
let failed = 0;
for (const project of TYPECHECK_PROJECTS) {
  const { ok } = await runTypecheck(root, project);
  if (!ok) failed++;
}
process.exitCode = failed === 0 ? 0 : 1;
