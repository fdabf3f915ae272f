/**
 * npm start: the local Plyledger on this machine, ready to sign in to.
 * Ctrl-C stops everything it started.
 */
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../../auth-fake/demo-accounts.ts';
import { startLocalStack } from './stack.ts';

const say = (line: string) => console.log(`[plyledger] ${line}`);

try {
  const stack = await startLocalStack('dev', say);
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
