/** Process exit codes of the `leadline` command; documented in the README and in `leadline --help`. */
export const EXIT_OK = 0;
/** An input was read but a check found what `--fail-on` asks to fail on. */
export const EXIT_FINDINGS = 1;
/** Wrong usage: an unknown verb or option, a missing argument. */
export const EXIT_USAGE = 2;
/** An input could not be read at all, or an output could not be written. */
export const EXIT_IO = 3;
/** A bug: something Leadline did not expect. */
export const EXIT_INTERNAL = 70;
