import { LEADLINE_VERSION } from '@leadline/core';
import { Command, CommanderError } from 'commander';
import { COMMANDS, type CommandContext } from './commands/index.js';
import { EXIT_INTERNAL, EXIT_OK, EXIT_USAGE } from './exit-codes.js';
import { type CliIo, createProcessIo } from './io.js';

const EXIT_CODE_HELP = `
Exit codes:
  0   success
  1   a check failed at the level --fail-on asks for
  2   wrong usage (unknown verb or option, missing argument)
  3   an input could not be read or an output could not be written
  70  internal error (please report it)

Positions from acoustic systems can be wrong by metres to tens of metres. Leadline documents
where a vehicle was; it is not a navigation aid.`;

/** Builds the `leadline` program; each verb registers itself from `commands/`. */
export function buildProgram(io: CliIo, context: CommandContext = { io, exitCode: EXIT_OK }): Command {
  const program = new Command('leadline')
    .description(
      'Check, clean, re-solve, convert, summarise and archive USBL position logs of underwater vehicles and divers.',
    )
    .version(LEADLINE_VERSION, '-V, --version', 'print the Leadline version')
    .helpOption('-h, --help', 'show help for leadline or a verb')
    .addHelpText('after', EXIT_CODE_HELP)
    .showHelpAfterError('(run leadline --help for the verbs and options)')
    .configureOutput({ writeOut: io.stdout, writeErr: io.stderr })
    .exitOverride();
  for (const register of COMMANDS) register(program, context);
  return program;
}

/** Runs the command line with `argv` (without node and script) and returns the exit code. */
export async function main(argv: readonly string[], io: CliIo = createProcessIo()): Promise<number> {
  const context: CommandContext = { io, exitCode: EXIT_OK };
  const program = buildProgram(io, context);
  if (argv.length === 0) {
    program.outputHelp();
    return EXIT_OK;
  }
  try {
    await program.parseAsync([...argv], { from: 'user' });
    return context.exitCode;
  } catch (error) {
    if (error instanceof CommanderError) {
      return error.exitCode === 0 ? EXIT_OK : EXIT_USAGE;
    }
    io.stderr(`leadline: internal error: ${error instanceof Error ? error.message : String(error)}\n`);
    return EXIT_INTERNAL;
  }
}
