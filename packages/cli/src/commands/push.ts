import { basename } from 'node:path';
import { InvalidArgumentError } from 'commander';
import { EXIT_IO, EXIT_OK, EXIT_USAGE } from '../exit-codes.js';
import type { CliIo } from '../io.js';
import { parsePositiveInteger } from '../support/common-options.js';
import { printJson } from '../support/print-json.js';
import { readInputBytes } from '../support/read-input.js';
import { resolveInputs } from '../support/resolve-inputs.js';
import { runPool } from '../support/run-pool.js';
import type { RegisterCommand } from './index.js';

/** The environment variable holding the API token `push` sends. */
export const TOKEN_VARIABLE = 'LEADLINE_TOKEN';

/** What `leadline push` was asked to do. */
export interface PushArgs {
  inputs: string[];
  server: string;
  project: string;
  token: string | undefined;
  jobs: number;
  json: boolean;
  quiet: boolean;
  cwd?: string;
}

/** One file's outcome, as `--json` prints it. */
export interface PushResult {
  file: string;
  status: 'created' | 'existing' | 'rejected' | 'failed';
  logId?: string;
  sha256?: string;
  message?: string;
}

/** Registers `leadline push`. */
export const registerPush: RegisterCommand = (program, context) => {
  program
    .command('push')
    .description('upload logs into a project on a Leadline server (token from LEADLINE_TOKEN)')
    .argument('<inputs...>', 'files, folders (recursed) or globs; - reads standard input')
    .requiredOption('--server <url>', 'the server, e.g. http://127.0.0.1:8480', parseServerUrl)
    .requiredOption('--project <id>', 'the project to archive the logs in')
    .option('--jobs <n>', 'uploads at once', parsePositiveInteger, 4)
    .option('--json', 'print one JSON document on standard output', false)
    .option('--quiet', 'print nothing but errors', false)
    .addHelpText(
      'after',
      `
The server keeps each file's bytes verbatim with its SHA-256; pushing the same file again returns the
log already archived. Create a read-write token on the server's web site, page API tokens (/tokens).

Examples:
  export LEADLINE_TOKEN=llt_...
  leadline push season/ --server http://127.0.0.1:8480 --project 6f1c...
  leadline push 'logs/**/*.csv' --server https://leadline.example --project 6f1c... --json`,
    )
    .action(async (inputs: string[], options: Omit<PushArgs, 'inputs' | 'token'>) => {
      context.exitCode = await runPush({ ...options, inputs, token: process.env[TOKEN_VARIABLE] }, context.io);
    });
};

function parseServerUrl(text: string): string {
  try {
    const url = new URL(text);
    if (url.protocol !== 'http:' && url.protocol !== 'https:') throw new Error('not http');
    return url.toString().replace(/\/+$/, '');
  } catch {
    throw new InvalidArgumentError(`expected an http:// or https:// address, got "${text}"`);
  }
}

/** Uploads every input into the project; returns the exit code (3 when any file could not be read or sent). */
export async function runPush(args: PushArgs, io: CliIo): Promise<number> {
  if (!args.token) {
    io.stderr(
      `leadline push: set ${TOKEN_VARIABLE} to an API token of the server (create one on its web site, page API tokens: /tokens)\n`,
    );
    return EXIT_USAGE;
  }
  const { inputs, problems } = await resolveInputs(args.inputs, args.cwd);
  for (const problem of problems) io.stderr(`leadline push: ${problem}\n`);
  if (inputs.length === 0) return problems.length > 0 ? EXIT_IO : EXIT_USAGE;

  const api = createApi(args.server, args.token);
  let organisationId: string;
  try {
    organisationId = await findProjectOrganisation(api, args.project);
  } catch (error) {
    io.stderr(`leadline push: ${(error as Error).message}\n`);
    return EXIT_USAGE;
  }

  const outcomes = await runPool(inputs, args.jobs, async (input): Promise<PushResult> => {
    const bytes = await readInputBytes(input);
    const form = new FormData();
    form.append('files', new Blob([new Uint8Array(bytes)]), input.path === '-' ? 'stdin' : basename(input.path));
    const body = await api.send('POST', `/organisations/${organisationId}/projects/${args.project}/logs`, form);
    const result = (
      body as {
        results?: Array<{
          status: PushResult['status'];
          log?: { id: string; sha256: string };
          error?: { message: string };
        }>;
      }
    ).results?.[0];
    if (result === undefined) throw new Error('the server answered without a result for the file');
    return {
      file: input.displayName,
      status: result.status,
      ...(result.log ? { logId: result.log.id, sha256: result.log.sha256 } : {}),
      ...(result.error ? { message: result.error.message } : {}),
    };
  });
  const results: PushResult[] = outcomes.map((outcome, i) =>
    outcome.ok
      ? outcome.value
      : { file: inputs[i]?.displayName ?? '?', status: 'failed', message: (outcome.error as Error).message },
  );

  if (args.json) printJson(io, results);
  for (const result of results) {
    if (result.status === 'failed' || result.status === 'rejected')
      io.stderr(`${result.file}: ${result.status}: ${result.message ?? ''}\n`);
    else if (!args.json && !args.quiet)
      io.stdout(
        `${result.file}: ${result.status === 'created' ? 'archived' : 'already archived'} (log ${result.logId})\n`,
      );
  }
  if (!args.json && !args.quiet) {
    const count = (status: PushResult['status']) => results.filter((r) => r.status === status).length;
    io.stdout(
      `pushed ${results.length} files: ${count('created')} new, ${count('existing')} already archived, ${count('rejected')} refused, ${count('failed')} failed\n`,
    );
  }
  return problems.length > 0 || results.some((r) => r.status === 'failed' || r.status === 'rejected')
    ? EXIT_IO
    : EXIT_OK;
}

interface Api {
  send(method: 'GET' | 'POST', path: string, body?: FormData): Promise<unknown>;
}

function createApi(server: string, token: string): Api {
  return {
    async send(method, path, body) {
      let response: Response;
      try {
        response = await fetch(`${server}/api/v1${path}`, {
          method,
          headers: { Authorization: `Bearer ${token}`, Accept: 'application/json' },
          ...(body ? { body } : {}),
        });
      } catch (error) {
        throw new Error(
          `cannot reach ${server}: ${(error as Error).cause instanceof Error ? ((error as Error).cause as Error).message : (error as Error).message}`,
        );
      }
      const text = await response.text();
      let parsed: unknown;
      try {
        parsed = text === '' ? {} : JSON.parse(text);
      } catch {
        throw new Error(
          `${server} answered ${response.status} with something that is not JSON; is it a Leadline server?`,
        );
      }
      // 422 still carries per-file results (every file refused); other failures carry the one error body.
      if (!response.ok && response.status !== 422) {
        const error = (parsed as { error?: { message?: string } }).error;
        throw new Error(`${server} answered ${response.status}: ${error?.message ?? 'no message'}`);
      }
      return parsed;
    },
  };
}

async function findProjectOrganisation(api: Api, projectId: string): Promise<string> {
  const me = (await api.send('GET', '/me')) as { memberships?: Array<{ organisationId: string }> };
  for (const membership of me.memberships ?? []) {
    try {
      await api.send('GET', `/organisations/${membership.organisationId}/projects/${projectId}`);
      return membership.organisationId;
    } catch {
      // not in this organisation; try the next
    }
  }
  throw new Error(`project ${projectId} is not in any organisation this token can reach`);
}
