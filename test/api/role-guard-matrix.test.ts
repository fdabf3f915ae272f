/**
 * Every state-changing route refuses every role that may not use it: a
 * table of (route x role) generated from the OpenAPI document's x-roles, sent
 * with a valid session and CSRF token, each expected to answer 403 in the
 * error shape and to change nothing.
 */
import { expect } from 'chai';
import { DEMO_ACCOUNTS } from '../../auth-fake/demo-accounts.ts';
import { readJson } from '../support/sign-in.ts';
import { apiUrl, testDb } from '../support/stack.ts';
import { session } from './coupon-chain-helpers.ts';

const MUTATING = ['post', 'put', 'patch', 'delete'];

interface Guarded { method: string; path: string; roles: string[] }

async function guardedOperations(): Promise<Guarded[]> {
  const doc = await readJson(await fetch(`${apiUrl()}/api/v1/openapi.json`));
  const list: Guarded[] = [];
  for (const [path, operations] of Object.entries(doc.paths as Record<string, Record<string, { 'x-roles'?: string[]; 'x-public'?: boolean }>>)) {
    for (const [method, op] of Object.entries(operations)) {
      if (!MUTATING.includes(method) || !op['x-roles']) continue;
      list.push({ method: method.toUpperCase(), path, roles: op['x-roles'] });
    }
  }
  return list;
}

describe('role guard: every mutating route x every role that may not use it', function () {
  this.timeout(60_000);

  it('answers 403 forbidden, and writes nothing, for each refused (route, role) pair', async () => {
    const operations = await guardedOperations();
    const paths = operations.map((o) => o.path);
    for (const expected of ['/api/v1/uploads', '/api/v1/materials', '/api/v1/analyses', '/api/v1/allowables', '/api/v1/allowables/{id}/approve', '/api/v1/allowables/{id}/reject', '/api/v1/specimens/{id}/exclude', '/api/v1/materials/{id}/ply-mapping']) {
      expect(paths, `${expected} is role-guarded in the OpenAPI document`).to.include(expected);
    }
    const counts = async () => {
      const rows = await Promise.all(['material_systems', 'specimens', 'uploads', 'analyses', 'allowables', 'ply_field_mappings', 'test_methods', 'conditions'].map(async (t) => Number((await testDb()(t).count('* as n').first())!.n)));
      return rows.join(',');
    };
    const before = await counts();
    const failures: string[] = [];
    let pairs = 0;
    for (const account of DEMO_ACCOUNTS) {
      const s = await session(account.login);
      for (const op of operations) {
        if (op.roles.some((r) => account.roles.includes(r))) continue;
        pairs++;
        const path = op.path.replace(/\{[^}]+\}/g, '1');
        const res = await s.api(path, { method: op.method, json: {} });
        const body = (res.status === 204 ? null : await res.json().catch(() => null)) as { error?: { code?: string } } | null;
        if (res.status !== 403 || body?.error?.code !== 'forbidden') failures.push(`${op.method} ${op.path} as ${account.login}: ${res.status} ${JSON.stringify(body).slice(0, 120)}`);
      }
    }
    expect(failures, failures.join('\n')).to.deep.equal([]);
    expect(pairs).to.be.greaterThan(50);
    expect(await counts(), 'nothing was written').to.equal(before);
  });

  it('lets the roles named in x-roles past the guard (the route answers, but not with 403)', async () => {
    const operations = await guardedOperations();
    for (const op of operations.filter((o) => o.path.startsWith('/api/v1/allowables') || o.path === '/api/v1/analyses')) {
      const login = DEMO_ACCOUNTS.find((a) => a.roles.includes(op.roles[0]))!.login;
      const res = await (await session(login)).api(op.path.replace(/\{[^}]+\}/g, '999999'), { method: op.method, json: {} });
      expect(res.status, `${op.method} ${op.path} as ${login}`).to.be.oneOf([400, 404]);
    }
  });
});
