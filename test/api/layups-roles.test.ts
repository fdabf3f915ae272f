/**
 * Role guards of the layup and export routes, table-driven: every route with
 * every demo account. Designers write layups; analysts and designers record
 * exports; everyone signed in reads. An allowed call must succeed (not merely
 * pass the guard), a refused one gets 403 and leaves nothing behind, and no
 * route answers without a session.
 */
import { expect } from 'chai';
import { DEMO_ACCOUNTS } from '../../auth-fake/demo-accounts.ts';
import { apiUrl, testDb } from '../support/stack.ts';
import { approvedAllowable, codeDraft, getJson, laminaMaterial, layupName, postJson, session, type LaminaMaterial } from './layups-fixtures.ts';

interface RouteCase {
  name: string;
  method: 'GET' | 'POST';
  path: () => string;
  body?: () => Promise<unknown> | unknown;
  /** absent: everyone signed in */
  roles?: string[];
  ok: number;
  /** table whose row count a refused call must leave as it was */
  writes?: string;
}

describe('layups and exports: role guards (routes x roles)', function () {
  this.timeout(90_000);
  let material: LaminaMaterial;
  let layupId: number;
  let revisionId: number;
  let exportId: number;
  let allowableId: number;

  before(async () => {
    material = await laminaMaterial();
    allowableId = await approvedAllowable(material.id, 'tension-0');
    const created = await postJson('designer', '/api/v1/layups', codeDraft(layupName('Guarded'), '[0/45/-45/90]s', material, { source: 'ply-property-set', conditionId: material.conditionId, basis: 'B' }));
    layupId = created.body.layupId;
    revisionId = created.body.id;
    const exported = await postJson('analyst', '/api/v1/exports?reply=json', { layupRevisionId: revisionId, format: 'json' });
    if (exported.status !== 201) throw new Error(JSON.stringify(exported.body));
    exportId = exported.body.id;
  });

  const latestRevision = async () => (await getJson('designer', `/api/v1/layups/${layupId}`)).body.latest.revision;

  const ROUTES: RouteCase[] = [
    { name: 'create a layup', method: 'POST', path: () => '/api/v1/layups', body: () => codeDraft(layupName('Role'), '[0/90]s', material), roles: ['designer'], ok: 201, writes: 'layups' },
    { name: 'revise a layup', method: 'POST', path: () => `/api/v1/layups/${layupId}/revisions`, body: async () => ({ ...codeDraft(undefined as never, '[0/90]s', material), basedOnRevision: await latestRevision() }), roles: ['designer'], ok: 201, writes: 'layup_revisions' },
    { name: 'duplicate a layup', method: 'POST', path: () => `/api/v1/layups/${layupId}/duplicate`, body: () => ({ name: layupName('Copy') }), roles: ['designer'], ok: 201, writes: 'layups' },
    { name: 'record an export', method: 'POST', path: () => '/api/v1/exports', body: () => ({ layupRevisionId: revisionId, format: 'calculix' }), roles: ['analyst', 'designer'], ok: 201, writes: 'section_exports' },
    { name: 'list layups', method: 'GET', path: () => '/api/v1/layups', ok: 200 },
    { name: 'read a layup', method: 'GET', path: () => `/api/v1/layups/${layupId}`, ok: 200 },
    { name: 'read a layup revision', method: 'GET', path: () => `/api/v1/layup-revisions/${revisionId}`, ok: 200 },
    { name: 'preview a layup', method: 'POST', path: () => '/api/v1/layups/preview', body: () => codeDraft(undefined as never, '[0/90]s', material), ok: 200 },
    { name: 'compare layup revisions', method: 'POST', path: () => '/api/v1/layups/compare', body: () => ({ a: revisionId, b: revisionId }), ok: 200 },
    { name: 'preview an export', method: 'POST', path: () => '/api/v1/exports/preview', body: () => ({ layupRevisionId: revisionId, format: 'nastran-pshell' }), ok: 200 },
    { name: 'list exports', method: 'GET', path: () => `/api/v1/exports?layupId=${layupId}`, ok: 200 },
    { name: 'read an export', method: 'GET', path: () => `/api/v1/exports/${exportId}`, ok: 200 },
    { name: 'download an export', method: 'GET', path: () => `/api/v1/exports/${exportId}/file`, ok: 200 },
    { name: 'read the impact of an allowable', method: 'GET', path: () => `/api/v1/allowables/${allowableId}/impact`, ok: 200 },
  ];

  const count = async (table: string) => Number((await testDb()(table).count('* as n').first())!.n);

  for (const route of ROUTES) {
    describe(`${route.method} ${route.name}`, () => {
      it('is refused without a session', async () => {
        const res = await fetch(`${apiUrl()}${route.path()}`, { method: route.method, redirect: 'manual', headers: { 'content-type': 'application/json' }, body: route.method === 'GET' ? undefined : JSON.stringify((await route.body?.()) ?? {}) });
        // a write without a session fails the CSRF check (403) or the session check (401) first
        expect(route.method === 'GET' ? [401] : [401, 403]).to.include(res.status);
      });

      for (const account of DEMO_ACCOUNTS) {
        const allowed = !route.roles || route.roles.some((r) => account.roles.includes(r));
        it(`${allowed ? 'answers' : 'refuses'} ${account.login} (${account.roles.join(', ') || 'no role'})`, async () => {
          const before = route.writes && !allowed ? await count(route.writes) : 0;
          const s = await session(account.login);
          const body = route.body ? await route.body() : undefined;
          const res = await s.api(route.path(), { method: route.method, ...(body !== undefined ? { json: body } : {}) });
          const text = await res.text();
          if (allowed) {
            expect(res.status, text.slice(0, 400)).to.equal(route.ok);
          } else {
            expect(res.status, text.slice(0, 400)).to.equal(403);
            expect(JSON.parse(text).error.code).to.equal('forbidden');
            expect(await count(route.writes!)).to.equal(before);
          }
        });
      }
    });
  }
});
