export type { PushArgs, PushResult } from './commands/push.js';
export { runPush, TOKEN_VARIABLE } from './commands/push.js';
export * from './exit-codes.js';
export type { CliIo } from './io.js';
export { buildProgram, main } from './main.js';
