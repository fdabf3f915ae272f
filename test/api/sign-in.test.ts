/**
 * Sign-in, sessions, roles and CSRF against the real stack: the API with
 * PostgreSQL sessions and the auth-fake OpenID Connect provider.
 */
import { expect } from 'chai';
import request from 'supertest';
import { DEMO_ACCOUNTS } from '../../auth-fake/demo-accounts.ts';
import { safeReturnTo } from '../../api/src/auth/auth.routes.ts';
import { throttleTouch, TOUCH_EVERY_MS } from '../../api/src/auth/session.ts';
import { signIn, CookieJar, readJson } from '../support/sign-in.ts';
import { apiUrl, stack, testDb } from '../support/stack.ts';

function expectErrorShape(body: unknown, code: string) {
  expect(body).to.have.nested.property('error.code', code);
  expect(body).to.have.nested.property('error.message').that.is.a('string').and.not.empty;
  expect(body).to.have.nested.property('error.details');
}

describe('sign-in with OpenID Connect (real auth-fake, real sessions)', () => {
  it('refuses /api/v1/me without a session: 401 in the API error shape', async () => {
    const res = await request(apiUrl()).get('/api/v1/me');
    expect(res.status).to.equal(401);
    expectErrorShape(res.body, 'unauthenticated');
  });

  it('sends /auth/login to the provider with PKCE (S256), state and nonce', async () => {
    const res = await request(apiUrl()).get('/auth/login');
    expect(res.status).to.equal(302);
    const location = new URL(res.headers.location);
    expect(location.origin).to.equal(new URL(stack().config.oidc.issuer).origin);
    expect(location.searchParams.get('code_challenge_method')).to.equal('S256');
    expect(location.searchParams.get('code_challenge')).to.match(/^[\w-]{43}$/);
    expect(location.searchParams.get('state')).to.be.a('string').and.not.empty;
    expect(location.searchParams.get('nonce')).to.be.a('string').and.not.empty;
  });

  for (const account of DEMO_ACCOUNTS) {
    it(`signs in ${account.login} and reports the roles from the ID token (${account.roles.join(', ') || 'none'})`, async () => {
      const session = await signIn(apiUrl(), account.login);
      const res = await session.api('/api/v1/me');
      expect(res.status).to.equal(200);
      const me = await readJson(res);
      expect(me.user.name).to.equal(account.name);
      expect(me.user.email).to.equal(account.email);
      expect(me.roles).to.deep.equal([...account.roles].sort());
    });
  }

  it('stores the session server-side in PostgreSQL and sets HttpOnly, SameSite=Lax cookies', async () => {
    const jar = new CookieJar();
    const session = await signIn(apiUrl(), 'designer');
    const sid = decodeURIComponent(session.jar.get('plyledger.sid')!).replace(/^s:/, '').split('.')[0];
    const row = await testDb()('sessions').where({ sid }).first();
    expect(row, 'session row').to.exist;
    expect(row.sess.user.roles).to.deep.equal(['designer']);
    const res = await session.api('/api/v1/me');
    jar.take(res);
    const login = await fetch(`${apiUrl()}/auth/login`, { redirect: 'manual' });
    const cookie = login.headers.getSetCookie().find((c) => c.startsWith('plyledger.sid='))!;
    expect(cookie).to.match(/HttpOnly/i).and.match(/SameSite=Lax/i);
  });

  it('ends a session after eight idle hours on the server; the cookie itself lasts the browser session', async () => {
    const session = await signIn(apiUrl(), 'designer');
    const sid = decodeURIComponent(session.jar.get('plyledger.sid')!).replace(/^s:/, '').split('.')[0];
    const login = await fetch(`${apiUrl()}/auth/login`, { redirect: 'manual' });
    const cookie = login.headers.getSetCookie().find((c) => c.startsWith('plyledger.sid='))!;
    expect(cookie, 'no Expires or Max-Age: the browser drops it when it closes').to.not.match(/expires=|max-age=/i);
    const row = await testDb()('sessions').where({ sid }).first('expire');
    const hoursLeft = (new Date(row.expire).getTime() - Date.now()) / 3600e3;
    expect(hoursLeft, 'idle limit written at sign-in (api/src/auth/session.ts: eight hours, the project\'s choice)').to.be.within(7.9, 8.01);
    // A signed-in request within the minute does not answer with a new cookie.
    const me = await session.api('/api/v1/me');
    expect(me.status).to.equal(200);
    expect(me.headers.getSetCookie().some((c) => c.startsWith('plyledger.sid='))).to.equal(false);
    // Past its expiry the row no longer signs anyone in. express-session writes a touch after the
    // reply has gone out, so the last touch (a few ms after the reply) may still land on the row:
    // set the expiry again until it holds; with touches throttled to once a minute, it does at once after that.
    let status = 0;
    for (let attempt = 0; attempt < 40 && status !== 401; attempt++) {
      if (attempt) await new Promise((resolve) => setTimeout(resolve, 50));
      await testDb()('sessions').where({ sid }).update({ expire: testDb().raw("now() - interval '1 second'") });
      status = (await session.api('/api/v1/me')).status;
    }
    expect(status).to.equal(401);
  });

  it('writes the sign-in to the audit log', async () => {
    await signIn(apiUrl(), 'analyst');
    const entry = await testDb()('audit_log').where({ action: 'user.signed-in', actor: 'Ane Fossdal' }).orderBy('id', 'desc').first();
    expect(entry).to.exist;
    expect(entry.details.roles).to.deep.equal(['analyst']);
  });

  it('rejects a wrong password at the provider and starts no session', async () => {
    let failed: Error | undefined;
    try {
      await signIn(apiUrl(), 'quality', 'not-the-password');
    } catch (err) {
      failed = err as Error;
    }
    expect(failed?.message).to.match(/did not end with a session/);
  });

  it('signs out: the session is destroyed and the provider end-session URL is returned', async () => {
    const session = await signIn(apiUrl(), 'quality');
    const out = await session.api('/auth/logout', { method: 'POST', json: {} });
    expect(out.status).to.equal(200);
    const { redirectTo } = await readJson(out);
    expect(redirectTo).to.match(/\/session\/end\?/);
    expect(new URL(redirectTo).searchParams.get('id_token_hint')).to.be.a('string');
    const after = await session.api('/api/v1/me');
    expect(after.status).to.equal(401);
  });

  it('refuses a state-changing request without the CSRF token, even with a valid session', async () => {
    const session = await signIn(apiUrl(), 'quality');
    const noToken = await fetch(`${apiUrl()}/auth/logout`, { method: 'POST', headers: { cookie: session.cookie } });
    expect(noToken.status).to.equal(403);
    expectErrorShape(await readJson(noToken), 'csrf');
    const wrongToken = await fetch(`${apiUrl()}/api/v1/me`, { method: 'POST', headers: { cookie: session.cookie, 'x-xsrf-token': 'forged' } });
    expect(wrongToken.status).to.equal(403);
    expect((await session.api('/api/v1/me')).status, 'the session survives the refused request').to.equal(200);
  });

  it('only returns to application paths after sign-in (no open redirect)', () => {
    expect(safeReturnTo('/layups/12')).to.equal('/layups/12');
    expect(safeReturnTo('//elsewhere.example/x')).to.equal('/');
    expect(safeReturnTo('https://elsewhere.example/')).to.equal('/');
    expect(safeReturnTo('/\\elsewhere.example')).to.equal('/');
    expect(safeReturnTo(undefined)).to.equal('/');
  });
});

describe('role guard', () => {
  it('gives 403 in the error shape to a signed-in user without the role', async () => {
    for (const login of ['viewer', 'designer', 'materials', 'analyst']) {
      const res = await (await signIn(apiUrl(), login)).api('/api/v1/audit-log');
      expect(res.status, login).to.equal(403);
      const body = await readJson(res);
      expectErrorShape(body, 'forbidden');
      expect(body.error.message).to.match(/quality or admin/);
    }
  });

  it('lets the quality reviewer and the administrator read the audit log', async () => {
    for (const login of ['quality', 'admin']) {
      const res = await (await signIn(apiUrl(), login)).api('/api/v1/audit-log?limit=5');
      expect(res.status, login).to.equal(200);
      const body = await readJson(res);
      expect(body.entries).to.be.an('array').that.is.not.empty;
      expect(body.entries[0]).to.include.keys('at', 'actor', 'action');
    }
  });

  it('validates query parameters with a message naming the field', async () => {
    const res = await (await signIn(apiUrl(), 'quality')).api('/api/v1/audit-log?limit=0');
    expect(res.status).to.equal(400);
    expect((await readJson(res)).error.message).to.match(/limit/);
  });
});

describe('the API surface', () => {
  it('answers unknown API routes with 404 in the error shape', async () => {
    const res = await request(apiUrl()).get('/api/v1/no-such-thing');
    expect(res.status).to.equal(401); // sign-in comes first: nothing about the API is told to strangers
    const session = await signIn(apiUrl(), 'viewer');
    const signedIn = await session.api('/api/v1/no-such-thing');
    expect(signedIn.status).to.equal(404);
    expectErrorShape(await readJson(signedIn), 'not_found');
  });

  it('sets security headers (helmet) with a same-origin content security policy', async () => {
    const res = await request(apiUrl()).get('/api/v1/health');
    expect(res.headers['content-security-policy']).to.include("default-src 'self'").and.include("script-src 'self'");
    expect(res.headers['x-content-type-options']).to.equal('nosniff');
    expect(res.headers['x-powered-by']).to.equal(undefined);
  });

  it('serves an OpenAPI 3 document that lists the routes and marks their roles', async () => {
    const res = await request(apiUrl()).get('/api/v1/openapi.json');
    expect(res.status).to.equal(200);
    expect(res.body.openapi).to.match(/^3\./);
    for (const path of ['/api/v1/health', '/api/v1/me', '/api/v1/audit-log', '/auth/login', '/auth/callback', '/auth/logout']) {
      expect(res.body.paths, path).to.have.property(path);
    }
    expect(res.body.paths['/api/v1/audit-log'].get['x-roles']).to.deep.equal(['quality', 'admin']);
    expect(res.body.components.schemas.Error).to.exist;
  });
});

describe('transfer', () => {
  it('compresses the client bundle and API replies (gzip)', async () => {
    const res = await request(apiUrl()).get('/api/v1/openapi.json').set('Accept-Encoding', 'gzip');
    expect(res.headers['content-encoding']).to.equal('gzip');
  });
});

describe('session expiry writes (throttleTouch)', () => {
  it('writes one session\'s expiry at most once a minute, each session on its own, and again after a failed write', () => {
    const writes: string[] = [];
    let fail = false;
    const store = { touch: (sid: string, _sess: unknown, done?: (err?: unknown) => void) => { writes.push(sid); done?.(fail ? new Error('database down') : undefined); } };
    let clock = 1_000_000;
    throttleTouch(store as never, TOUCH_EVERY_MS, () => clock);
    const touch = (sid: string) => new Promise((resolve) => store.touch(sid, {}, resolve));
    return (async () => {
      await touch('a');
      await touch('a');
      await touch('b');
      clock += TOUCH_EVERY_MS - 1;
      await touch('a');
      expect(writes).to.deep.equal(['a', 'b']);
      clock += 1;
      fail = true;
      expect(await touch('a')).to.be.instanceOf(Error);
      fail = false;
      await touch('a');
      expect(writes, 'a failed write is tried again on the next request').to.deep.equal(['a', 'b', 'a', 'a']);
    })();
  });
});
