import type { CliCommand } from '../command.ts';
import { basisCommand } from './basis.ts';
import { checkCommand } from './check.ts';
import { envelopeCommand } from './envelope.ts';
import { laminateCommand } from './laminate.ts';
import { polarCommand } from './polar.ts';
import { sectionCommand } from './section.ts';

/**
 * Every command of `plyledger`, in the order `--help` lists them. Engine issues
 * add their commands here (one file per command in this folder).
 */
export const commands: CliCommand[] = [basisCommand, laminateCommand, envelopeCommand, polarCommand, sectionCommand, checkCommand];
