/**
 * npm start: the local Plyledger on this machine, ready to sign in to.
 * Ctrl-C stops everything it started.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../../auth-fake/demo-accounts.ts';
import { repoRoot, startLocalStack } from './stack.ts';

const say = (line: string) => console.log(`[plyledger] ${line}`);
/** npm run dev: the Angular dev server on 4200 with live reload, proxying /api and /auth to the API. */
const dev = process.argv.includes('--dev');
const DEV_SERVER_PORT = 4200;
if (dev) process.env.PLYLEDGER_APP_URL ??= `http://127.0.0.1:${DEV_SERVER_PORT}`;

try {
  const stack = await startLocalStack('dev', say, { buildClient: !dev });
  let devServer: ChildProcess | undefined;
  if (dev) {
    devServer = spawn(
      process.execPath,
      [path.join(repoRoot, 'node_modules/@angular/cli/bin/ng.js'), 'serve', '--host', '127.0.0.1', '--port', String(DEV_SERVER_PORT), '--proxy-config', 'client/proxy.conf.json'],
      { cwd: repoRoot, stdio: 'inherit', env: { ...process.env, NG_CLI_ANALYTICS: 'false' } },
    );
  }
  const width = Math.max(...DEMO_ACCOUNTS.map((a) => a.login.length));
  console.log(`
  Plyledger is running:       ${stack.config.appUrl}
  Local inbox (e-mail):       ${stack.mail.inboxUrl}
  Identity provider (demo):   ${stack.authFake.issuer}

  Demo accounts (password "${DEMO_PASSWORD}"), all invented:
${DEMO_ACCOUNTS.map((a) => `    ${a.login.padEnd(width)}  ${a.name.padEnd(16)} ${a.roles.join(', ') || '(no role: read only)'}`).join('\n')}

  Press Ctrl-C to stop.
`);
  let stopping = false;
  const shutdown = async () => {
    if (stopping) return;
    stopping = true;
    say('stopping…');
    devServer?.kill('SIGTERM');
    await stack.stop();
    say('stopped');
    process.exit(0);
  };
  process.on('SIGINT', shutdown);
  process.on('SIGTERM', shutdown);
} catch (err) {
  console.error(`[plyledger] could not start: ${(err as Error).message}`);
  process.exit(1);
}
