import type { CliCommand } from '../registry.ts';

/** Every command of the CLI. Add a new command file and list it here. */
export const COMMANDS: CliCommand[] = [];
