/**
 * Two API processes against one database with no sticky routing: a session
 * made through one works through the other, a change through one is seen
 * through the other. Also: sign-in rate limiting on a separately limited instance.
 */
import { expect } from 'chai';
import { startApi, type RunningApi } from '../../api/src/server.ts';
import { readJson, signIn } from '../support/sign-in.ts';
import { apiUrl, stack } from '../support/stack.ts';

describe('scale-out: a second API instance on the same database', function () {
  this.timeout(60_000);
  let second: RunningApi;

  before(async () => {
    second = await startApi({ ...stack().config, apiPort: stack().config.apiPort + 50, clientDist: stack().config.clientDist });
  });
  after(async () => {
    await second?.close();
  });

  it('accepts a session made through the first instance, and the sign-out through the second ends it on both', async () => {
    const session = await signIn(apiUrl(), 'quality');
    const me = await fetch(`${second.url}/api/v1/me`, { headers: { cookie: session.jar.header() } });
    expect(me.status).to.equal(200);
    expect((await readJson(me)).roles).to.deep.equal(['quality']);

    const out = await fetch(`${second.url}/auth/logout`, { method: 'POST', headers: { cookie: session.jar.header(), 'x-xsrf-token': session.csrf } });
    expect(out.status).to.equal(200);
    expect((await session.api('/api/v1/me')).status, 'first instance').to.equal(401);
  });

  it('shows through the second instance what was written through the first', async () => {
    const materials = await signIn(apiUrl(), 'materials');
    const reviewer = await signIn(apiUrl(), 'admin');
    const res = await fetch(`${second.url}/api/v1/audit-log?action=user.signed-in&limit=20`, { headers: { cookie: reviewer.jar.header() } });
    expect(res.status).to.equal(200);
    const actors = (await readJson(res)).entries.map((e: { actor: string }) => e.actor);
    expect(actors).to.include('Mira Solheim');
    expect(materials.csrf).to.be.a('string');
  });
});

describe('sign-in rate limiting', function () {
  this.timeout(30_000);
  let limited: RunningApi;
  const saved = process.env.PLYLEDGER_SIGN_IN_LIMIT_PER_MINUTE;

  before(async () => {
    process.env.PLYLEDGER_SIGN_IN_LIMIT_PER_MINUTE = '3';
    limited = await startApi({ ...stack().config, apiPort: stack().config.apiPort + 51 });
  });
  after(async () => {
    if (saved === undefined) delete process.env.PLYLEDGER_SIGN_IN_LIMIT_PER_MINUTE;
    else process.env.PLYLEDGER_SIGN_IN_LIMIT_PER_MINUTE = saved;
    await limited?.close();
  });

  it('answers 429 in the error shape after the limit of sign-in attempts per minute', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await fetch(`${limited.url}/auth/login`, { redirect: 'manual' })).status);
    expect(statuses).to.deep.equal([302, 302, 302, 429]);
    const refused = await fetch(`${limited.url}/auth/login`, { redirect: 'manual' });
    expect((await readJson(refused)).error.code).to.equal('too_many_sign_ins');
  });
});
