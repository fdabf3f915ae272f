/**
 * The whole local Plyledger: PostgreSQL (migrated and seeded), the stand-in
 * identity provider, the fake SMTP server with its inbox, and the API serving
 * the built client. `npm start` runs the dev profile; `npm test` the test
 * profile, on other ports with a fresh database.
 */
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import knexFactory from 'knex';
import { authFakeOptionsFor, startAuthFake, type AuthFake } from '../../../auth-fake/server.ts';
import { clusterFor, ensureDatabase, startCluster, stopCluster, type Cluster } from '../../../database/local-server.ts';
import { knexSettings } from '../../../database/knexfile.ts';
import { migrateLatest, runSeeds } from '../../../database/migrate.ts';
import { loadConfig, type Config, type Profile } from '../config.ts';
import { startApi, type RunningApi } from '../server.ts';
import { buildClientIfStale } from './client-build.ts';
import { startMailFake, type MailFake } from './mail-fake.ts';

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');

export interface LocalStack {
  config: Config;
  cluster: Cluster;
  authFake: AuthFake;
  mail: MailFake;
  api: RunningApi;
  stop: () => Promise<void>;
}

export async function startLocalStack(profile: Profile, log: (line: string) => void = console.log, options: { freshDatabase?: boolean; buildClient?: boolean } = {}): Promise<LocalStack> {
  process.env.PLYLEDGER_PROFILE = profile;
  const config = loadConfig(process.env, profile);
  const cluster = clusterFor(profile);
  const stops: Array<() => Promise<unknown>> = [];
  const stop = async () => {
    for (const s of stops.reverse()) await s().catch((err) => log(`while stopping: ${(err as Error).message}`));
  };
  try {
    const started = await startCluster(cluster, log);
    if (started === 'started') stops.push(() => stopCluster(cluster));
    log(`database ${started} on 127.0.0.1:${cluster.port}`);
    await ensureDatabase(cluster, config.database.database, { fresh: options.freshDatabase });
    const db = knexFactory(knexSettings(profile));
    try {
      const applied = await migrateLatest(db);
      await runSeeds(db);
      log(`database ${config.database.database} migrated (${applied.length ? applied.length + ' new' : 'up to date'}) and seeded`);
    } finally {
      await db.destroy();
    }
    const authFake = await startAuthFake(authFakeOptionsFor(config));
    stops.push(() => authFake.close());
    const mail = await startMailFake({ smtpPort: config.smtp.port, inboxPort: config.smtp.inboxPort });
    stops.push(() => mail.close());
    if (options.buildClient !== false) await buildClientIfStale(repoRoot, config.clientDist, log);
    const api = await startApi({ ...config, clientDist: path.resolve(repoRoot, config.clientDist) });
    stops.push(() => api.close());
    return { config, cluster, authFake, mail, api, stop };
  } catch (err) {
    await stop();
    throw err;
  }
}
