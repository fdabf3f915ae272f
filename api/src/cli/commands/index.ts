import type { CliCommand } from '../command.ts';

/**
 * Every command of `plyledger`, in the order `--help` lists them. Engine issues
 * add their commands here (one file per command in this folder).
 */
export const commands: CliCommand[] = [];
