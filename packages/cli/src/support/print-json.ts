import type { CliIo } from '../io.js';

/** Prints one JSON document on standard output, keys in a stable order, with a trailing newline. */
export function printJson(io: CliIo, value: unknown): void {
  io.stdout(`${JSON.stringify(value, sortKeys, 2)}\n`);
}

function sortKeys(_key: string, value: unknown): unknown {
  if (value === null || typeof value !== 'object' || Array.isArray(value)) return value;
  return Object.fromEntries(
    Object.entries(value as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)),
  );
}
