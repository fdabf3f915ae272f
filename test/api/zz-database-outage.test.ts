/**
 * The database stops and comes back: health says so, signed-in requests get
 * 503 in the error shape while it is down, and the API recovers by itself.
 * (File name sorts last in test/api: it stops the shared test database.)
 */
import { expect } from 'chai';
import { startCluster, stopCluster } from '../../database/local-server.ts';
import { readJson, signIn } from '../support/sign-in.ts';
import { apiUrl, stack } from '../support/stack.ts';

async function health() {
  const res = await fetch(`${apiUrl()}/api/v1/health`);
  return { status: res.status, body: await readJson(res) };
}

async function waitFor<T>(probe: () => Promise<T>, ok: (value: T) => boolean, timeoutMs: number): Promise<T> {
  const until = Date.now() + timeoutMs;
  let value = await probe();
  while (!ok(value) && Date.now() < until) {
    await new Promise((r) => setTimeout(r, 250));
    value = await probe();
  }
  return value;
}

describe('database outage and recovery', function () {
  this.timeout(120_000);

  it('reports the database up, then down while stopped, then up again after restart', async () => {
    const session = await signIn(apiUrl(), 'quality');
    const before = await health();
    expect(before.status).to.equal(200);
    expect(before.body.database.status).to.equal('up');

    await stopCluster(stack().cluster);
    try {
      const down = await health();
      expect(down.status).to.equal(503);
      expect(down.body.database.status).to.equal('down');
      expect(down.body.database.message).to.be.a('string');

      const me = await session.api('/api/v1/me');
      expect(me.status, 'a session lookup cannot be made').to.equal(503);
      const body = await readJson(me);
      expect(body.error.code).to.equal('database_unavailable');
      expect(JSON.stringify(body)).not.to.match(/ECONNREFUSED|at .*\.ts:\d+/);
    } finally {
      await startCluster(stack().cluster);
    }
    const after = await waitFor(health, (h) => h.status === 200, 20_000);
    expect(after.status).to.equal(200);
    expect(after.body.database.status).to.equal('up');
    const me = await waitFor(() => session.api('/api/v1/me'), (r) => r.status === 200, 20_000);
    expect(me.status, 'the session stored before the outage still works').to.equal(200);
  });
});
