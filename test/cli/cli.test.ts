/** The command-line entry: help, unknown commands, exit codes. */
import { expect } from 'chai';
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import path from 'node:path';
import { runCli } from '../../api/src/cli/main.ts';
import { commands } from '../../api/src/cli/commands/index.ts';
import { repoRoot } from '../../api/src/local/stack.ts';

function bufferIo(stdin = '') {
  const out = { stdout: '', stderr: '' };
  return { out, io: { stdout: (t: string) => (out.stdout += t), stderr: (t: string) => (out.stderr += t), readStdin: async () => stdin } };
}

describe('plyledger CLI', () => {
  it('prints help listing every command, exit 0', async () => {
    const { out, io } = bufferIo();
    expect(await runCli(['--help'], io)).to.equal(0);
    expect(out.stdout).to.match(/Usage: plyledger <command>/);
    for (const c of commands) expect(out.stdout).to.include(c.name);
  });

  it('exits 2 with one line on standard error for an unknown command', async () => {
    const { out, io } = bufferIo();
    expect(await runCli(['frobnicate'], io)).to.equal(2);
    expect(out.stderr.trim().split('\n')).to.have.length(1);
    expect(out.stderr).to.match(/unknown command 'frobnicate'/);
  });

  it('runs as the package bin `plyledger`', async () => {
    const { stdout } = await promisify(execFile)(process.execPath, [path.join(repoRoot, 'api/bin/plyledger.js'), '--help']);
    expect(stdout).to.match(/Usage: plyledger/);
  });
});
