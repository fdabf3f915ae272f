/**
 * Demo people of the invented scenario (PRODUCT.md): staff of "Fjordvik
 * Rotorworks", a fictional blade and nacelle maker. Names are invented; the
 * e-mail domain is under the reserved .example top-level domain.
 * One account per role, a second quality reviewer (a reviewer may not decide
 * their own proposal, and two reviewers are needed to show it), and a viewer
 * with no role.
 */
export interface DemoAccount {
  login: string;
  name: string;
  email: string;
  roles: string[];
  title: string;
}

export const DEMO_PASSWORD = 'plyledger-demo';

const domain = 'fjordvik-rotorworks.example';

export const DEMO_ACCOUNTS: DemoAccount[] = [
  { login: 'materials', name: 'Mira Solheim', title: 'Materials engineer', roles: ['materials-engineer'] },
  { login: 'designer', name: 'Dag Eikrem', title: 'Designer', roles: ['designer'] },
  { login: 'quality', name: 'Kari Vollan', title: 'Quality reviewer', roles: ['quality'] },
  { login: 'quality2', name: 'Tor Brekkevik', title: 'Quality reviewer', roles: ['quality'] },
  { login: 'analyst', name: 'Ane Fossdal', title: 'Analyst', roles: ['analyst'] },
  { login: 'admin', name: 'Sig Halvorsrud', title: 'Administrator', roles: ['admin'] },
  { login: 'viewer', name: 'Vera Nystuen', title: 'Viewer (no role)', roles: [] },
].map((a) => ({ ...a, email: `${a.login}@${domain}` }));

export function findDemoAccount(login: string): DemoAccount | undefined {
  return DEMO_ACCOUNTS.find((a) => a.login === login.trim().toLowerCase());
}
