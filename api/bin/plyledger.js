#!/usr/bin/env node
// Entry for the `plyledger` bin: runs the TypeScript CLI through tsx's loader.
import { register } from 'tsx/esm/api';
import { fileURLToPath } from 'node:url';

register();
const { runCli, readProcessStdin } = await import(fileURLToPath(new URL('../src/cli/main.ts', import.meta.url)));
process.exitCode = await runCli(process.argv.slice(2), {
  stdout: (t) => process.stdout.write(t),
  stderr: (t) => process.stderr.write(t),
  readStdin: readProcessStdin,
});
