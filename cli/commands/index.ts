import type { CliCommand } from '../registry.ts';
import { lineCommand } from './line.ts';
import { exportCommand } from './export.ts';
import { buildCommand } from './build.ts';
import { sweepCommand } from './sweep.ts';
import { yieldCommand } from './yield.ts';
import { sectionCommand } from './section.ts';
import { couponCommand } from './coupon.ts';
import { blockCommand } from './block.ts';
import { equalizeCommand } from './equalize.ts';
import { tuneCommand } from './tune.ts';
import { reportCommand } from './report.ts';
import { editCommand } from './edit.ts';

/** Every command of the CLI. Add a new command file and list it here. */
export const COMMANDS: CliCommand[] = [lineCommand, exportCommand, buildCommand, sweepCommand, yieldCommand, sectionCommand, couponCommand, blockCommand, equalizeCommand, tuneCommand, reportCommand, editCommand];
