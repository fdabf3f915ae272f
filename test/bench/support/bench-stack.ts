/**
 * The Plyledger a bench section measures: PostgreSQL with a fresh database,
 * the stand-in identity provider and the mail fake in this process (through
 * startLocalStack), and the API in a child process of its own. The API runs
 * apart so that its memory can be read from /proc/<pid>/status and so that a
 * load generator in this process does not share the API's event loop.
 *
 * Ports and the cluster folder are the bench's own (set below unless the
 * environment sets them), so `npm run bench` runs beside `npm start` and
 * `npm test` stacks.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import knexFactory, { type Knex } from 'knex';
import { repoRoot, startLocalStack, type LocalStack } from '../../../api/src/local/stack.ts';
import { knexSettings } from '../../../database/knexfile.ts';
import { signIn, type SignedIn } from '../../support/sign-in.ts';

const BENCH_SETTINGS: Record<string, string> = {
  PLYLEDGER_CLUSTER_NAME: 'bench',
  PLYLEDGER_DB_PORT: '55933',
  PLYLEDGER_API_PORT: '4901',
  PLYLEDGER_AUTH_FAKE_PORT: '4911',
  PLYLEDGER_SMTP_PORT: '4927',
  PLYLEDGER_INBOX_PORT: '4928',
  PLYLEDGER_LOG_LEVEL: 'warn',
};

const API_START_TIMEOUT_MS = 60_000;

export interface BenchStack {
  apiUrl: string;
  /** Process id of the API's own node process (for /proc/<pid>/status). */
  apiPid: number;
  /** Knex on the bench database, for setting up data and EXPLAIN. */
  db: Knex;
  database: LocalStack['config']['database'];
  /** One signed-in session per demo login, made on first use. */
  session: (login: string) => Promise<SignedIn>;
  stop: () => Promise<void>;
}

function waitForExit(child: ChildProcess, ms: number): Promise<boolean> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve(true);
  return new Promise((resolve) => {
    const timer = setTimeout(() => resolve(false), ms);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve(true);
    });
  });
}

/** Starts `node --import tsx api/src/server.ts` (node itself, not the tsx wrapper, so the pid is the API's) and waits for its health route. */
async function spawnApi(apiUrl: string, log: (line: string) => void): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(repoRoot, 'api/src/server.ts')], {
    cwd: repoRoot,
    env: { ...process.env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const keep = (chunk: Buffer) => {
    output = (output + chunk.toString()).slice(-4000);
  };
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);
  const started = Date.now();
  while (Date.now() - started < API_START_TIMEOUT_MS) {
    if (child.exitCode !== null) throw new Error(`the API process ended with code ${child.exitCode} before it answered: ${output}`);
    const up = await fetch(`${apiUrl}/api/v1/health`).then((r) => r.ok, () => false);
    if (up) {
      log(`API in its own process (pid ${child.pid}) at ${apiUrl}`);
      return child;
    }
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  child.kill('SIGKILL');
  throw new Error(`the API process did not answer ${apiUrl}/api/v1/health within ${API_START_TIMEOUT_MS / 1000} s: ${output}`);
}

/**
 * Starts the stack for one section. The API that startLocalStack runs in this
 * process is closed at once and the same port is served by the child process
 * (the identity provider's redirect address names that port).
 */
export async function startBenchStack(log: (line: string) => void = (line) => console.log(`[bench] ${line}`)): Promise<BenchStack> {
  for (const [name, value] of Object.entries(BENCH_SETTINGS)) process.env[name] ??= value;
  const stack = await startLocalStack('test', log, { freshDatabase: true, buildClient: false });
  let child: ChildProcess | undefined;
  let db: Knex | undefined;
  const stop = async () => {
    if (child) {
      child.kill('SIGTERM');
      if (!(await waitForExit(child, 5000))) {
        child.kill('SIGKILL');
        await waitForExit(child, 5000);
      }
    }
    await db?.destroy();
    await stack.stop();
  };
  try {
    await stack.api.close();
    const apiUrl = stack.api.url;
    child = await spawnApi(apiUrl, log);
    db = knexFactory({ ...knexSettings('test'), pool: { min: 0, max: 4 } });
    const sessions = new Map<string, Promise<SignedIn>>();
    return {
      apiUrl,
      apiPid: child.pid!,
      db,
      database: stack.config.database,
      session: (login) => {
        if (!sessions.has(login)) sessions.set(login, signIn(apiUrl, login));
        return sessions.get(login)!;
      },
      stop,
    };
  } catch (err) {
    await stop();
    throw err;
  }
}
