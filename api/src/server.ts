/**
 * Starts the API with its database pool and OpenID Connect client.
 *   tsx api/src/server.ts          (npm start runs the whole local stack)
 */
import type { Server } from 'node:http';
import os from 'node:os';
import { pathToFileURL } from 'node:url';
import pg from 'pg';
import { pino } from 'pino';
import { createApp } from './app.ts';
import { createOidcClient } from './auth/oidc-client.ts';
import { setEngineThreads } from './calculations/engine-runner.ts';
import { loadConfig, type Config } from './config.ts';
import { sweepStaleUploads } from './coupons/upload-middleware.ts';
import { createDb } from './db.ts';

export interface RunningApi {
  url: string;
  server: Server;
  close: () => Promise<void>;
}

export async function startApi(config: Config = loadConfig()): Promise<RunningApi> {
  const logger = pino({ level: config.logLevel, base: { service: 'plyledger-api' } });
  // Engine work in worker threads (PLYLEDGER_ENGINE_THREADS=0 keeps it inline).
  setEngineThreads(Number(process.env.PLYLEDGER_ENGINE_THREADS ?? Math.max(1, os.availableParallelism() - 1)));
  const db = createDb(config);
  const pool = new pg.Pool({ ...config.database, max: 5, connectionTimeoutMillis: 3000, idleTimeoutMillis: 10000 });
  // An idle connection cut by a database restart must not crash the process.
  pool.on('error', (err) => logger.warn({ reason: err.message }, 'session pool connection lost'));
  const { app } = createApp({ config, db, pool, oidc: createOidcClient(config), logger });
  // Temporary upload files left by a process that stopped mid-upload.
  void sweepStaleUploads().then((n) => n && logger.info({ removed: n }, 'removed stale temporary upload files'));
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(config.apiPort, config.apiHost, () => resolve(s));
    s.once('error', (err: NodeJS.ErrnoException) =>
      reject(err.code === 'EADDRINUSE' ? new Error(`API: port ${config.apiPort} on ${config.apiHost} is taken; stop the other program or set PLYLEDGER_API_PORT`) : err),
    );
  });
  return {
    url: `http://${config.apiHost}:${config.apiPort}`,
    server,
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await Promise.allSettled([db.destroy(), pool.end()]);
    },
  };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const api = await startApi();
  console.log(`[api] listening at ${api.url}`);
}
