/**
 * The running test stack (started once by test/run.ts for the whole suite):
 * API, auth-fake, mail fake and the throwaway database, on the test profile's ports.
 */
import knexFactory, { type Knex } from 'knex';
import type { LocalStack } from '../../api/src/local/stack.ts';
import { knexSettings } from '../../database/knexfile.ts';

// Kept on globalThis: mocha loads the test files through its own module loader,
// so this module may exist twice (once for test/run.ts, once for the suites).
const shared = globalThis as typeof globalThis & { plyledgerTestStack?: LocalStack };
let db: Knex | undefined;

export function setStack(stack: LocalStack | undefined): void {
  shared.plyledgerTestStack = stack;
}

export function stack(): LocalStack {
  const current = shared.plyledgerTestStack;
  if (!current) throw new Error('the test stack is not running: run the suites through `npm test` (test/run.ts)');
  return current;
}

export const apiUrl = () => stack().api.url;

/** A Knex handle on the test database, for assertions the API cannot make. */
export function testDb(): Knex {
  db ??= knexFactory({ ...knexSettings('test'), pool: { min: 0, max: 4 } });
  return db;
}

export async function closeTestDb(): Promise<void> {
  await db?.destroy();
  db = undefined;
}
