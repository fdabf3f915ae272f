/**
 * Access to every route of the OpenAPI document, generated from the document
 * itself so that a new route cannot escape: without a session, and with every
 * demo account. `x-roles` says who may; everyone else must get 403, nobody a 5xx,
 * and no reply may carry a stack trace or SQL.
 */
import { expect } from 'chai';
import { DEMO_ACCOUNTS } from '../../auth-fake/demo-accounts.ts';
import { readJson, signIn, type SignedIn } from '../support/sign-in.ts';
import { apiUrl } from '../support/stack.ts';

interface Operation {
  method: string;
  path: string;
  roles?: string[];
  isPublic: boolean;
}

const LEAKS = /\n\s+at [^\n]+:\d+:\d+|\b(select|insert into|update|delete from)\b[^"]*\b(from|set|values|where)\b|node_modules|ECONNREFUSED/i;

async function operations(): Promise<Operation[]> {
  const doc = await readJson(await fetch(`${apiUrl()}/api/v1/openapi.json`));
  const ops: Operation[] = [];
  for (const [path, item] of Object.entries(doc.paths as Record<string, Record<string, Record<string, unknown>>>)) {
    for (const [method, op] of Object.entries(item)) {
      if (!['get', 'post', 'put', 'patch', 'delete'].includes(method)) continue;
      ops.push({ method: method.toUpperCase(), path, roles: op['x-roles'] as string[] | undefined, isPublic: op['x-public'] === true });
    }
  }
  return ops;
}

/** A concrete URL for a path template: ids become 1, other parameters a harmless word. */
function concrete(path: string): string {
  return path.replace(/\{([^}]+)\}/g, (_m, name: string) => (/id$/i.test(name) ? '1' : 'json'));
}

async function expectNoLeak(res: Response, label: string) {
  const text = await res.text();
  expect(res.status, `${label}: no 5xx`).to.be.below(500);
  expect(text, `${label}: no stack trace or SQL`).not.to.match(LEAKS);
  if (res.status >= 400 && (res.headers.get('content-type') ?? '').includes('json')) {
    expect(JSON.parse(text), `${label}: error shape`).to.have.nested.property('error.code');
  }
}

describe('access to every route in the OpenAPI document', function () {
  this.timeout(180_000);
  let ops: Operation[];
  const sessions = new Map<string, SignedIn>();

  before(async () => {
    ops = await operations();
    for (const account of DEMO_ACCOUNTS) sessions.set(account.login, await signIn(apiUrl(), account.login));
  });

  it('lists routes to test (the document is not empty)', () => {
    expect(ops.length).to.be.above(5);
  });

  it('refuses every non-public route without a session (401, error shape)', async () => {
    for (const op of ops.filter((o) => !o.isPublic)) {
      const res = await fetch(`${apiUrl()}${concrete(op.path)}`, { method: op.method, redirect: 'manual', headers: { 'content-type': 'application/json' }, body: op.method === 'GET' ? undefined : '{}' });
      const label = `${op.method} ${op.path} without session`;
      // A write without a session fails the CSRF check first (403) or the session check (401): either refuses it.
      expect([401, 403], label).to.include(res.status);
      await expectNoLeak(res, label);
    }
  });

  it('answers public routes without a session, without a 5xx', async () => {
    for (const op of ops.filter((o) => o.isPublic && o.method === 'GET')) {
      const res = await fetch(`${apiUrl()}${concrete(op.path)}`, { redirect: 'manual' });
      await expectNoLeak(res, `${op.method} ${op.path} public`);
    }
  });

  for (const account of DEMO_ACCOUNTS) {
    it(`gives ${account.login} (${account.roles.join(', ') || 'no role'}) exactly the routes of their roles`, async () => {
      const session = sessions.get(account.login)!;
      for (const op of ops.filter((o) => !o.isPublic)) {
        const res = await session.api(concrete(op.path), { method: op.method, ...(op.method === 'GET' ? {} : { json: {} }) });
        const label = `${op.method} ${op.path} as ${account.login}`;
        const allowed = !op.roles || op.roles.some((r) => account.roles.includes(r));
        if (allowed) expect([401, 403], `${label}: must be let through`).not.to.include(res.status);
        else expect(res.status, `${label}: must be refused`).to.equal(403);
        await expectNoLeak(res, label);
      }
    });
  }
});
