import { readFile } from 'node:fs/promises';
import { InputError } from '../shared/input-error.ts';

/** What a command may write to; the CLI entry passes the process streams, tests pass buffers. */
export interface CliIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Reads standard input whole (used when no FILE argument is given). */
  readStdin: () => Promise<string>;
}

export interface CliCommand {
  name: string;
  /** One line for `plyledger --help`. */
  summary: string;
  /** Usage text for `plyledger <name> --help`. */
  usage: string;
  /** Returns the exit code. Throw InputError (or UsageError) for bad input: the entry prints one line and exits 2. */
  run: (args: string[], io: CliIo) => Promise<number>;
}

/** A mistake in the command line itself (unknown flag, missing value). */
export class UsageError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'UsageError';
  }
}

/** Reads JSON from the FILE argument, or from standard input when there is none or it is `-`. */
export async function readJsonInput(file: string | undefined, io: CliIo): Promise<unknown> {
  let text: string;
  try {
    text = file && file !== '-' ? await readFile(file, 'utf8') : await io.readStdin();
  } catch (err) {
    throw new UsageError(`cannot read ${file ?? 'standard input'}: ${(err as Error).message}`);
  }
  if (text.trim() === '') throw new InputError({ field: 'input', message: 'is empty', fix: 'pass a JSON document as FILE or on standard input' });
  try {
    return JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (err) {
    throw new InputError({ field: 'input', message: `is not valid JSON (${(err as Error).message})`, fix: 'check the file is JSON' });
  }
}

/** Splits `--flag value` / `--flag=value` options from positional arguments. */
export function parseOptions(args: string[], known: Record<string, 'value' | 'boolean'>): { options: Record<string, string | boolean>; positional: string[] } {
  const options: Record<string, string | boolean> = {};
  const positional: string[] = [];
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    if (arg === '-' || !arg.startsWith('-')) {
      positional.push(arg);
      continue;
    }
    const [flag, inline] = arg.replace(/^--?/, '').split(/=(.*)/s, 2);
    const kind = known[flag];
    if (!kind) throw new UsageError(`unknown option --${flag}`);
    if (kind === 'boolean') {
      options[flag] = true;
    } else {
      const value = inline ?? args[++i];
      if (value === undefined) throw new UsageError(`--${flag} needs a value`);
      options[flag] = value;
    }
  }
  return { options, positional };
}

/** Prints JSON the way every command does: two-space indent, trailing newline. */
export function writeJson(io: CliIo, value: unknown): void {
  io.stdout(JSON.stringify(value, null, 2) + '\n');
}
