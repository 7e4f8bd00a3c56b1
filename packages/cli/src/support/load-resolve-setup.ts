import { readFile } from 'node:fs/promises';
import { resolve as resolvePath } from 'node:path';
import { parseResolveSetup, type ResolveSetup } from '@leadline/core';
import { UsageProblem } from './usage-problem.js';

/**
 * Reads a re-solve setup given to `--setup` as inline JSON, as the name of a setup in the config
 * file, or as a JSON file, and validates it; every problem is a `UsageProblem` naming where it is.
 */
export async function loadResolveSetup(
  text: string,
  named: Record<string, unknown>,
  cwd: string,
): Promise<ResolveSetup> {
  let raw: unknown;
  let where: string;
  if (text.trimStart().startsWith('{')) {
    where = 'the --setup JSON';
    raw = parseJsonText(text, where);
  } else if (Object.hasOwn(named, text)) {
    where = `setup "${text}" in the config file`;
    raw = named[text];
  } else {
    where = resolvePath(cwd, text);
    let fileText: string;
    try {
      fileText = await readFile(where, 'utf8');
    } catch {
      const names = Object.keys(named);
      throw new UsageProblem(
        `--setup ${text}: no such file${names.length > 0 ? ` and no setup by that name (config setups: ${names.join(', ')})` : ''}`,
      );
    }
    raw = parseJsonText(fileText, where);
  }
  try {
    return parseResolveSetup(raw);
  } catch (error) {
    throw new UsageProblem(`${where}: ${(error as Error).message}`);
  }
}

/** Parses JSON, or throws a `UsageProblem` saying where the text came from. */
export function parseJsonText(text: string, where: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new UsageProblem(`${where}: not valid JSON (${(error as Error).message})`);
  }
}
