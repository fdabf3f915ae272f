/** The first tables, as migrated into the suite's database. */
import { expect } from 'chai';
import { ROLE_CODES } from '../../api/src/users/roles.ts';
import { DEMO_ACCOUNTS } from '../../auth-fake/demo-accounts.ts';
import { testDb } from '../support/stack.ts';

describe('schema: people, sessions, audit log', () => {
  it('has the five roles of PRODUCT.md', async () => {
    const rows = await testDb()('roles').orderBy('code').pluck('code');
    expect(rows).to.deep.equal([...ROLE_CODES].sort());
  });

  it('seeds one user per demo account with their roles', async () => {
    const users = await testDb()('users').whereIn('subject', DEMO_ACCOUNTS.map((a) => a.login)).select('id', 'subject');
    expect(users).to.have.length(DEMO_ACCOUNTS.length);
    const viewer = users.find((u) => u.subject === 'viewer');
    expect(await testDb()('user_roles').where({ user_id: viewer.id })).to.be.empty;
  });

  it('keeps the audit log append-only, even for direct SQL', async () => {
    const [row] = await testDb()('audit_log').insert({ actor: 'schema test', action: 'test.appended' }).returning('id');
    let updateError = '';
    await testDb()('audit_log').where({ id: row.id }).update({ action: 'test.rewritten' }).catch((e) => (updateError = e.message));
    expect(updateError).to.match(/append-only/);
    let deleteError = '';
    await testDb()('audit_log').where({ id: row.id }).delete().catch((e) => (deleteError = e.message));
    expect(deleteError).to.match(/append-only/);
  });

  it('refuses a role that does not exist', async () => {
    const user = await testDb()('users').first();
    let message = '';
    await testDb()('user_roles').insert({ user_id: user.id, role_code: 'superuser' }).catch((e) => (message = e.message));
    expect(message).to.match(/foreign key/);
  });
});
