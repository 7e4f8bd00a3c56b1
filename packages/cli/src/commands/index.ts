import type { Command } from 'commander';
import type { CliIo } from '../io.js';
import { registerAudit } from './audit.js';
import { registerCompletion } from './completion.js';
import { registerConvert } from './convert.js';
import { registerCrs } from './crs.js';
import { registerInspect } from './inspect.js';
import { registerPush } from './push.js';
import { registerResolve } from './resolve.js';
import { registerSimulate } from './simulate.js';
import { registerSplit } from './split.js';

/** What every verb's registration receives: where to write, and where to leave its exit code. */
export interface CommandContext {
  io: CliIo;
  /** The verb's action sets this; `main` returns it. */
  exitCode: number;
}

/** Registers one verb on the program. Each `commands/<verb>.ts` exports one of these. */
export type RegisterCommand = (program: Command, context: CommandContext) => void;

/** Every verb, in the order `leadline --help` lists them. Add a verb by adding its register function here. */
export const COMMANDS: readonly RegisterCommand[] = [
  registerInspect,
  registerConvert,
  registerAudit,
  registerSplit,
  registerResolve,
  registerSimulate,
  registerCrs,
  registerPush,
  registerCompletion,
];
