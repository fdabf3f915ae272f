/**
 * The local PostgreSQL server of Plyledger: Debian's PostgreSQL 15 binaries, a
 * cluster in a git-ignored folder (database/.data/<profile>), listening only on
 * 127.0.0.1 at the project's own port. PostgreSQL refuses to run as root, so
 * when this process is root every server command runs as the `postgres` user.
 *
 *   npm run db -- start|stop|status [--test]
 *
 * start, stop and status are idempotent; a stale postmaster.pid does not block a
 * start; a port taken by another program is reported as such.
 */
import { execFile, execFileSync } from 'node:child_process';
import { chownSync, existsSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync, appendFileSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { promisify } from 'node:util';
import pg from 'pg';
import { loadConfig, type Profile } from '../api/src/config.ts';
import { ensureDebianPackage } from '../api/src/local/debian-package.ts';

const run = promisify(execFile);
const here = path.dirname(fileURLToPath(import.meta.url));

export interface Cluster {
  profile: Profile;
  port: number;
  user: string;
  password: string;
  /** Folder that holds pgdata/ and the server log. */
  home: string;
  dataDir: string;
  logFile: string;
}

export type ClusterState = 'running' | 'stopped' | 'absent';

const isRoot = () => process.getuid?.() === 0;

/** Finds pg_ctl and initdb of PostgreSQL 15 or newer (PLYLEDGER_PG_BIN overrides), installing Debian's package when none is there. */
export function findPostgresBinaries(): string {
  const fromEnv = process.env.PLYLEDGER_PG_BIN;
  if (fromEnv) {
    if (!existsSync(path.join(fromEnv, 'pg_ctl'))) throw new Error(`PLYLEDGER_PG_BIN=${fromEnv} has no pg_ctl`);
    return fromEnv;
  }
  const find = () => {
    const root = '/usr/lib/postgresql';
    if (!existsSync(root)) return undefined;
    const versions = readdirSync(root).map(Number).filter((v) => v >= 15).sort((a, b) => b - a);
    return versions.map((v) => path.join(root, String(v), 'bin')).find((dir) => existsSync(path.join(dir, 'pg_ctl')));
  };
  let dir = find();
  if (!dir) {
    ensureDebianPackage('postgresql', '/usr/lib/postgresql/15/bin/pg_ctl');
    dir = find();
  }
  if (!dir) throw new Error('PostgreSQL 15 binaries not found under /usr/lib/postgresql; install the Debian package postgresql');
  return dir;
}

/** Can the postgres user reach (traverse) this folder? A clone under a private home folder cannot be. */
function reachableByPostgres(dir: string): boolean {
  if (!isRoot()) return true;
  try {
    execFileSync('runuser', ['-u', 'postgres', '--', 'test', '-x', dir, '-a', '-w', dir], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

export function clusterFor(profile: Profile, env: NodeJS.ProcessEnv = process.env): Cluster {
  const { database } = loadConfig(env, profile);
  let base = path.join(here, '.data');
  mkdirSync(base, { recursive: true });
  ownByPostgres(base);
  if (!reachableByPostgres(base)) {
    // The repository sits where the postgres user may not go (e.g. under /root):
    // keep the cluster in the system's temporary folder instead, named after the checkout.
    const tag = Buffer.from(here).toString('base64url').slice(-24);
    base = path.join(os.tmpdir(), `plyledger-pg-${tag}`);
  }
  // PLYLEDGER_CLUSTER_NAME lets a second stack of one profile run beside the first (other ports, other folder).
  const name = env.PLYLEDGER_CLUSTER_NAME ?? profile;
  if (!/^[a-z0-9-]+$/.test(name)) throw new Error(`PLYLEDGER_CLUSTER_NAME must be lower-case letters, digits and -, got '${name}'`);
  const home = path.join(base, name);
  return {
    profile,
    port: database.port,
    user: database.user,
    password: database.password,
    home,
    dataDir: path.join(home, 'pgdata'),
    logFile: path.join(home, 'server.log'),
  };
}

/** Runs a PostgreSQL server program as the postgres user when we are root. */
async function asPostgres(program: string, args: string[]): Promise<{ stdout: string; stderr: string }> {
  const bin = path.join(findPostgresBinaries(), program);
  const [cmd, argv] = isRoot() ? ['runuser', ['-u', 'postgres', '--', bin, ...args]] : [bin, args];
  return run(cmd, argv, { encoding: 'utf8' });
}

let postgresIds: { uid: number; gid: number } | undefined;

function ownByPostgres(target: string) {
  if (!isRoot()) return;
  if (!postgresIds) {
    findPostgresBinaries(); // the postgres user comes with Debian's package
    const id = (flag: string) => Number(execFileSync('id', [flag, 'postgres'], { encoding: 'utf8' }).trim());
    postgresIds = { uid: id('-u'), gid: id('-g') };
  }
  chownSync(target, postgresIds.uid, postgresIds.gid);
}

export async function clusterState(cluster: Cluster): Promise<ClusterState> {
  if (!existsSync(path.join(cluster.dataDir, 'PG_VERSION'))) return 'absent';
  try {
    await asPostgres('pg_ctl', ['status', '-D', cluster.dataDir]);
    return 'running';
  } catch {
    return 'stopped';
  }
}

async function initCluster(cluster: Cluster) {
  mkdirSync(cluster.home, { recursive: true });
  ownByPostgres(cluster.home);
  const pwFile = path.join(cluster.home, '.pwfile');
  writeFileSync(pwFile, cluster.password + '\n', { mode: 0o600 });
  ownByPostgres(pwFile);
  try {
    await asPostgres('initdb', [
      '-D', cluster.dataDir, '-U', cluster.user, `--pwfile=${pwFile}`,
      '--auth-host=scram-sha-256', '--auth-local=peer', '--encoding=UTF8', '--locale=C',
    ]);
  } finally {
    rmSync(pwFile, { force: true });
  }
  const settings = [
    '',
    '# Plyledger local server',
    "listen_addresses = '127.0.0.1'",
    `port = ${cluster.port}`,
    "unix_socket_directories = ''",
    'max_connections = 100',
    // A throwaway test cluster trades durability for speed; the dev cluster keeps the defaults.
    ...(cluster.profile === 'test' ? ['fsync = off', 'synchronous_commit = off', 'full_page_writes = off'] : []),
  ];
  appendFileSync(path.join(cluster.dataDir, 'postgresql.conf'), settings.join('\n') + '\n');
}

/** A postmaster.pid left by a server that died: remove it when its pid is not a live postgres process. */
function clearStalePidFile(cluster: Cluster): boolean {
  const pidFile = path.join(cluster.dataDir, 'postmaster.pid');
  if (!existsSync(pidFile)) return false;
  const pid = Number(readFileSync(pidFile, 'utf8').split('\n')[0]);
  let alive = false;
  try {
    alive = Number.isInteger(pid) && pid > 0 && readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('postgres');
  } catch {
    alive = false;
  }
  if (alive) return false;
  rmSync(pidFile, { force: true });
  return true;
}

function portIsFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const probe = net.createServer();
    probe.once('error', () => resolve(false));
    probe.listen(port, '127.0.0.1', () => probe.close(() => resolve(true)));
  });
}

export async function startCluster(cluster: Cluster, log: (line: string) => void = () => {}): Promise<'started' | 'already running'> {
  findPostgresBinaries();
  if ((await clusterState(cluster)) === 'absent') {
    log(`creating a PostgreSQL cluster in ${cluster.dataDir}`);
    await initCluster(cluster);
  }
  if ((await clusterState(cluster)) === 'running') return 'already running';
  if (clearStalePidFile(cluster)) log('removed a stale postmaster.pid left by a server that is no longer running');
  if (!(await portIsFree(cluster.port))) {
    throw new Error(
      `port ${cluster.port} on 127.0.0.1 is taken by another program, so the Plyledger database cannot start there; ` +
        `stop that program or choose another port with PLYLEDGER_DB_PORT`,
    );
  }
  if (!existsSync(cluster.logFile)) {
    writeFileSync(cluster.logFile, '');
    ownByPostgres(cluster.logFile);
  }
  try {
    await asPostgres('pg_ctl', ['start', '-D', cluster.dataDir, '-l', cluster.logFile, '-w', '-t', '60', '-o', `-p ${cluster.port}`]);
  } catch (err) {
    const tail = existsSync(cluster.logFile) ? readFileSync(cluster.logFile, 'utf8').split('\n').slice(-8).join('\n') : '';
    throw new Error(`PostgreSQL did not start: ${(err as Error).message.trim()}\n${tail}`);
  }
  return 'started';
}

export async function stopCluster(cluster: Cluster): Promise<'stopped' | 'not running'> {
  if ((await clusterState(cluster)) !== 'running') {
    clearStalePidFile(cluster);
    return 'not running';
  }
  await asPostgres('pg_ctl', ['stop', '-D', cluster.dataDir, '-m', 'fast', '-w', '-t', '60']);
  return 'stopped';
}

/** Creates the application database when it is missing; `fresh` drops it first (the test suite's throwaway database). */
export async function ensureDatabase(cluster: Cluster, name: string, options: { fresh?: boolean } = {}): Promise<void> {
  if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`database name '${name}' must be lower-case letters, digits and _`);
  const client = new pg.Client({ host: '127.0.0.1', port: cluster.port, user: cluster.user, password: cluster.password, database: 'postgres' });
  await client.connect();
  try {
    if (options.fresh) await client.query(`drop database if exists ${name} with (force)`);
    const { rowCount } = await client.query('select 1 from pg_database where datname = $1', [name]);
    if (!rowCount) await client.query(`create database ${name}`);
  } finally {
    await client.end();
  }
}

async function main(argv: string[]) {
  const profile: Profile = argv.includes('--test') ? 'test' : 'dev';
  const action = argv.find((a) => !a.startsWith('-')) ?? 'status';
  const cluster = clusterFor(profile);
  const say = (line: string) => console.log(`[database] ${line}`);
  if (action === 'start') {
    const result = await startCluster(cluster, say);
    await ensureDatabase(cluster, loadConfig(process.env, profile).database.database);
    say(`${result} on 127.0.0.1:${cluster.port} (data in ${cluster.dataDir})`);
  } else if (action === 'stop') {
    say(await stopCluster(cluster));
  } else if (action === 'status') {
    const state = await clusterState(cluster);
    say(`${state}${state === 'running' ? ` on 127.0.0.1:${cluster.port}` : ''} (data in ${cluster.dataDir})`);
    process.exitCode = state === 'running' ? 0 : 3;
  } else {
    console.error(`usage: npm run db -- start|stop|status [--test]`);
    process.exitCode = 2;
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  main(process.argv.slice(2)).catch((err) => {
    console.error(`[database] ${(err as Error).message}`);
    process.exitCode = 1;
  });
}

