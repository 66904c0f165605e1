/**
 * The CLI's commands, one file each under cli/commands/. A command parses its own flags (node:util parseArgs),
 * does its work through core/, and returns an exit code: 0 success, 1 the input was invalid (errors listed),
 * 2 a bad command line (one-line reason plus usage).
 */
export interface CliIo {
  out: (text: string) => void;
  err: (text: string) => void;
  /** Directory relative paths are resolved against. */
  cwd: string;
}

export interface CliCommand {
  name: string;
  /** One line for the overview. */
  summary: string;
  /** Full usage text, shown by `stripwright help NAME` and after a usage error. */
  usage: string;
  /** Usage for these arguments, when it depends on them (e.g. `block KIND --help`). */
  usageFor?(argv: string[]): string;
  run(argv: string[], io: CliIo): Promise<number>;
}

/** Thrown by a command for a bad command line; the dispatcher prints reason + usage and exits 2. */
export class UsageError extends Error {
  override name = 'UsageError';
}
