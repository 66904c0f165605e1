import type { CliCommand } from '../registry.ts';
import { lineCommand } from './line.ts';

/** Every command of the CLI. Add a new command file and list it here. */
export const COMMANDS: CliCommand[] = [lineCommand];
