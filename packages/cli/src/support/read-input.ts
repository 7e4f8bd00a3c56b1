import { readFile } from 'node:fs/promises';
import type { InputFile } from './resolve-inputs.js';

/** Reads an input's bytes whole (standard input for `-`). */
export async function readInputBytes(
  input: InputFile,
  stdin: NodeJS.ReadableStream = process.stdin,
): Promise<Uint8Array> {
  if (input.path !== '-') return new Uint8Array(await readFile(input.path));
  const chunks: Buffer[] = [];
  for await (const chunk of stdin) chunks.push(typeof chunk === 'string' ? Buffer.from(chunk) : chunk);
  return new Uint8Array(Buffer.concat(chunks));
}
