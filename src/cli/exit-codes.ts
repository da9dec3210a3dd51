/** The command line's exit codes (documented in the README and in `fall --help`). */
export const EXIT = {
  /** Every run finished (converged or reached its step limit); or the file checked clean. */
  done: 0,
  /** Bad input: the file, an option, the output folder or the shards; nothing was written. */
  badInput: 1,
  /** The outputs were written, but some runs diverged or failed. */
  someRunsTroubled: 2,
  /** Stopped by Ctrl-C (SIGINT) or SIGTERM; nothing half-written, earlier shards intact. */
  interrupted: 130,
} as const;

/** An error the user can fix, with the exit code to leave with. */
export class CliError extends Error {
  constructor(
    message: string,
    readonly exitCode: number = EXIT.badInput,
  ) {
    super(message);
  }
}
