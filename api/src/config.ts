/**
 * Every setting of the API and the local stack, read from the environment with
 * the local defaults. The ports are Plyledger's own (44xx for HTTP/SMTP, 554xx
 * for PostgreSQL) so they do not collide with other programs' usual ones.
 * `profile` picks the default ports: `dev` for `npm start`, `test` for `npm test`.
 */
export type Profile = 'dev' | 'test';

export interface Config {
  profile: Profile;
  /** Where people open the application (the API serves the client here). */
  appUrl: string;
  apiPort: number;
  apiHost: string;
  database: { host: string; port: number; user: string; password: string; database: string };
  oidc: {
    issuer: string;
    clientId: string;
    clientSecret: string;
    /** Name of the ID-token / userinfo claim that carries the role identifiers. */
    rolesClaim: string;
    scopes: string;
  };
  /** Port of the local stand-in identity provider (auth-fake), when it is run. */
  authFakePort: number;
  smtp: { host: string; port: number; from: string; inboxPort: number };
  sessionSecret: string;
  logLevel: string;
  /** Folder of the built client (index.html inside). */
  clientDist: string;
}

const DEFAULT_PORTS: Record<Profile, { api: number; db: number; idp: number; smtp: number; inbox: number }> = {
  dev: { api: 4400, db: 55432, idp: 4410, smtp: 4425, inbox: 4426 },
  test: { api: 4401, db: 55433, idp: 4411, smtp: 4427, inbox: 4428 },
};

export function loadConfig(env: NodeJS.ProcessEnv = process.env, profile: Profile = (env.PLYLEDGER_PROFILE as Profile) || 'dev'): Config {
  const ports = DEFAULT_PORTS[profile] ?? DEFAULT_PORTS.dev;
  const int = (name: string, fallback: number) => {
    const raw = env[name];
    if (raw === undefined || raw === '') return fallback;
    const value = Number(raw);
    if (!Number.isInteger(value) || value <= 0) throw new Error(`${name} must be a positive whole number, got '${raw}'`);
    return value;
  };
  const apiPort = int('PLYLEDGER_API_PORT', ports.api);
  const authFakePort = int('PLYLEDGER_AUTH_FAKE_PORT', ports.idp);
  return {
    profile,
    appUrl: env.PLYLEDGER_APP_URL ?? `http://127.0.0.1:${apiPort}`,
    apiPort,
    apiHost: env.PLYLEDGER_API_HOST ?? '127.0.0.1',
    database: {
      host: env.PLYLEDGER_DB_HOST ?? '127.0.0.1',
      port: int('PLYLEDGER_DB_PORT', ports.db),
      user: env.PLYLEDGER_DB_USER ?? 'plyledger',
      password: env.PLYLEDGER_DB_PASSWORD ?? 'plyledger-local',
      database: env.PLYLEDGER_DB_NAME ?? (profile === 'test' ? 'plyledger_test' : 'plyledger'),
    },
    oidc: {
      issuer: env.PLYLEDGER_OIDC_ISSUER ?? `http://127.0.0.1:${authFakePort}`,
      clientId: env.PLYLEDGER_OIDC_CLIENT_ID ?? 'plyledger-web',
      clientSecret: env.PLYLEDGER_OIDC_CLIENT_SECRET ?? 'plyledger-local-client-secret',
      rolesClaim: env.PLYLEDGER_OIDC_ROLES_CLAIM ?? 'roles',
      scopes: env.PLYLEDGER_OIDC_SCOPES ?? 'openid profile email roles',
    },
    authFakePort,
    smtp: {
      host: env.PLYLEDGER_SMTP_HOST ?? '127.0.0.1',
      port: int('PLYLEDGER_SMTP_PORT', ports.smtp),
      from: env.PLYLEDGER_MAIL_FROM ?? 'Plyledger <plyledger@fjordvik-rotorworks.example>',
      inboxPort: int('PLYLEDGER_INBOX_PORT', ports.inbox),
    },
    sessionSecret: env.PLYLEDGER_SESSION_SECRET ?? 'plyledger-local-session-secret-change-me',
    logLevel: env.PLYLEDGER_LOG_LEVEL ?? (profile === 'test' ? 'warn' : 'info'),
    clientDist: env.PLYLEDGER_CLIENT_DIST ?? 'dist/client/browser',
  };
}
