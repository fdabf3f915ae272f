import knexFactory, { type Knex } from 'knex';
import type { Config } from './config.ts';

/**
 * The API's Knex instance. Short timeouts so that a database that is down is
 * reported (503) within seconds instead of holding requests for a minute.
 */
export function createDb(config: Config, overrides: Partial<Knex.Config> = {}): Knex {
  return knexFactory({
    client: 'pg',
    connection: { ...config.database, connectionTimeoutMillis: 3000 },
    pool: { min: 0, max: 10, idleTimeoutMillis: 10000 },
    acquireConnectionTimeout: 5000,
    ...overrides,
  });
}
