// @ts-check
import { run } from './processes.mjs';

/** The tsconfig projects `npm run typecheck` checks, each on its own. */
export const TYPECHECK_PROJECTS = [
  '.',
  'packages/core',
  'packages/cli',
  'packages/server',
  'packages/web',
  'packages/web/tsconfig.test.json',
];

/** Type-checks one project and prints its result. @param {string} root @param {string} project */
export async function runTypecheck(root, project) {
  const { code } = await run(process.execPath, ['node_modules/typescript/bin/tsc', '--noEmit', '-p', project], {
    cwd: root,
  });
  process.stdout.write(`typecheck ${project}: ${code === 0 ? 'ok' : 'FAILED'}\n`);
  return { ok: code === 0 };
}
