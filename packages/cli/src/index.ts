export * from './exit-codes.js';
export type { CliIo } from './io.js';
export { buildProgram, main } from './main.js';
