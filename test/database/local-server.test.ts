/**
 * The local PostgreSQL script, on a cluster of its own (not the suite's):
 * idempotent start/stop/status, a stale pid file, a port that is taken.
 */
import { expect } from 'chai';
import { rmSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { clusterFor, clusterState, startCluster, stopCluster, type Cluster } from '../../database/local-server.ts';

describe('database/local-server.ts', function () {
  this.timeout(120_000);
  const home = path.join(os.tmpdir(), `plyledger-cluster-check-${process.pid}`);
  const cluster: Cluster = { ...clusterFor('test'), port: 55439, home, dataDir: path.join(home, 'pgdata'), logFile: path.join(home, 'server.log') };

  after(async () => {
    await stopCluster(cluster).catch(() => undefined);
    rmSync(home, { recursive: true, force: true });
  });

  it('creates the cluster on first start, and start, status and stop are idempotent', async () => {
    expect(await clusterState(cluster)).to.equal('absent');
    expect(await startCluster(cluster)).to.equal('started');
    expect(await startCluster(cluster)).to.equal('already running');
    expect(await clusterState(cluster)).to.equal('running');
    expect(await stopCluster(cluster)).to.equal('stopped');
    expect(await stopCluster(cluster)).to.equal('not running');
    expect(await clusterState(cluster)).to.equal('stopped');
  });

  it('starts despite a stale postmaster.pid left by a server that died', async () => {
    writeFileSync(path.join(cluster.dataDir, 'postmaster.pid'), `999999\n${cluster.dataDir}\n`);
    const log: string[] = [];
    expect(await startCluster(cluster, (l) => log.push(l))).to.equal('started');
    expect(log.join('\n')).to.match(/stale postmaster\.pid/);
    await stopCluster(cluster);
  });

  it('says clearly that the port is taken by another program', async () => {
    const squatter = net.createServer();
    await new Promise<void>((resolve) => squatter.listen(cluster.port, '127.0.0.1', () => resolve()));
    try {
      let message = '';
      await startCluster(cluster).catch((err) => (message = (err as Error).message));
      expect(message).to.match(new RegExp(`port ${cluster.port} on 127\\.0\\.0\\.1 is taken by another program`));
      expect(message).to.match(/PLYLEDGER_DB_PORT/);
    } finally {
      await new Promise((r) => squatter.close(r));
    }
  });
});
