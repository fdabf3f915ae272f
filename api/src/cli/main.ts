/**
 * `plyledger <command>`: the engines from the command line. JSON in (FILE or
 * standard input), JSON or text out, exit code 2 and one line on standard
 * error for bad input. All numbers in the internal units of ENGINEERING.md.
 */
import { pathToFileURL } from 'node:url';
import { InputError } from '../shared/input-error.ts';
import { UsageError, type CliIo } from './command.ts';
import { commands } from './commands/index.ts';

function helpText(): string {
  const width = Math.max(8, ...commands.map((c) => c.name.length));
  const lines = commands.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`);
  return [
    'Usage: plyledger <command> [options] [FILE]',
    '',
    'Plyledger engines from the command line. Input is JSON from FILE or standard',
    'input; output is JSON on standard output. Units: mm, N, MPa, N/mm, N·mm/mm, °C.',
    '',
    'Commands:',
    ...(lines.length ? lines : ['  (none yet)']),
    '',
    'Run `plyledger <command> --help` for a command\'s input and options.',
    'Exit codes: 0 done, 1 unexpected failure, 2 bad input or usage.',
    '',
  ].join('\n');
}

export async function runCli(argv: string[], io: CliIo): Promise<number> {
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === '-h' || name === 'help') {
    io.stdout(helpText());
    return name ? 0 : 2;
  }
  const command = commands.find((c) => c.name === name);
  if (!command) {
    io.stderr(`plyledger: unknown command '${name}'; run plyledger --help for the list\n`);
    return 2;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.stdout(command.usage.endsWith('\n') ? command.usage : command.usage + '\n');
    return 0;
  }
  try {
    return await command.run(rest, io);
  } catch (err) {
    if (err instanceof InputError || err instanceof UsageError) {
      io.stderr(`plyledger ${name}: ${err.message.split('\n')[0]}\n`);
      return 2;
    }
    io.stderr(`plyledger ${name}: unexpected failure: ${(err as Error).stack ?? String(err)}\n`);
    return 1;
  }
}

export async function readProcessStdin(): Promise<string> {
  if (process.stdin.isTTY) return '';
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

const isEntry = process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href;
if (isEntry) {
  const code = await runCli(process.argv.slice(2), {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    readStdin: readProcessStdin,
  });
  process.exitCode = code;
}
