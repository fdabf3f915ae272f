/**
 * auth-fake: a local OpenID Connect provider (oidc-provider) that stands in for
 * the company's identity provider. It issues ID tokens with a `roles` claim for
 * the demo accounts of demo-accounts.ts. The API knows nothing of it beyond the
 * issuer URL, client id and secret: any standards-compliant provider does.
 *
 *   tsx auth-fake/server.ts        (npm start runs it for you)
 */
import { generateKeyPairSync, randomBytes } from 'node:crypto';
import type { Server } from 'node:http';
import { pathToFileURL } from 'node:url';
import express from 'express';
import Provider, { type Configuration, type KoaContextWithOIDC } from 'oidc-provider';
import { loadConfig } from '../api/src/config.ts';
import { DEMO_PASSWORD, findDemoAccount } from './demo-accounts.ts';
import { errorPage, signInPage, signOutPage, signedOutPage } from './pages.ts';

export interface AuthFakeOptions {
  issuer: string;
  port: number;
  clientId: string;
  clientSecret: string;
  /** Where the relying party may send the user back (the API's /auth/callback, and the app's root after sign-out). */
  redirectUris: string[];
  postLogoutRedirectUris: string[];
}

export interface AuthFake {
  issuer: string;
  close: () => Promise<void>;
}

function signingKey() {
  const { privateKey } = generateKeyPairSync('rsa', { modulusLength: 2048 });
  return { ...privateKey.export({ format: 'jwk' }), kid: `auth-fake-${randomBytes(4).toString('hex')}`, use: 'sig', alg: 'RS256' };
}

export function createProvider(options: AuthFakeOptions): Provider {
  const configuration: Configuration = {
    clients: [
      {
        client_id: options.clientId,
        client_secret: options.clientSecret,
        client_name: 'Plyledger',
        redirect_uris: options.redirectUris,
        post_logout_redirect_uris: options.postLogoutRedirectUris,
        response_types: ['code'],
        grant_types: ['authorization_code'],
        token_endpoint_auth_method: 'client_secret_basic',
      },
    ],
    async findAccount(_ctx, id) {
      const account = findDemoAccount(id);
      if (!account) return undefined;
      return {
        accountId: account.login,
        async claims() {
          return { sub: account.login, name: account.name, email: account.email, email_verified: true, roles: account.roles };
        },
      };
    },
    claims: { openid: ['sub'], profile: ['name'], email: ['email', 'email_verified'], roles: ['roles'] },
    scopes: ['openid', 'profile', 'email', 'roles'],
    // Put the requested claims (roles among them) in the ID token itself, as many company providers do.
    conformIdTokenClaims: false,
    pkce: { required: () => true },
    jwks: { keys: [signingKey() as never] },
    cookies: { keys: [randomBytes(32).toString('hex')] },
    interactions: { url: (_ctx, interaction) => `/interaction/${interaction.uid}` },
    features: {
      devInteractions: { enabled: false },
      rpInitiatedLogout: {
        enabled: true,
        logoutSource: async (ctx: KoaContextWithOIDC, form: string) => {
          ctx.body = signOutPage(form);
        },
        postLogoutSuccessSource: async (ctx: KoaContextWithOIDC) => {
          ctx.body = signedOutPage();
        },
      },
    },
    async renderError(ctx, out) {
      ctx.type = 'html';
      ctx.body = errorPage(String(out.error), out.error_description as string | undefined);
    },
    ttl: { Session: 8 * 3600, Interaction: 600, Grant: 8 * 3600, IdToken: 3600, AccessToken: 3600, AuthorizationCode: 60 },
  };
  return new Provider(options.issuer, configuration);
}

export async function startAuthFake(options: AuthFakeOptions): Promise<AuthFake> {
  const provider = createProvider(options);
  const app = express();
  app.disable('x-powered-by');
  const form = express.urlencoded({ extended: false, limit: '10kb' });

  app.get('/interaction/:uid', async (req, res, next) => {
    try {
      const details = await provider.interactionDetails(req, res);
      const { prompt, params, session } = details;
      if (prompt.name === 'login') {
        res.type('html').send(signInPage({ action: `/interaction/${details.uid}/login`, clientName: 'Plyledger' }));
        return;
      }
      // Consent: Plyledger is the company's own application, so grant what it asked for without a question.
      const grant = details.grantId ? await provider.Grant.find(details.grantId) : new provider.Grant({ accountId: session!.accountId, clientId: String(params.client_id) });
      const missing = prompt.details as { missingOIDCScope?: string[]; missingOIDCClaims?: string[] };
      if (missing.missingOIDCScope) grant!.addOIDCScope(missing.missingOIDCScope.join(' '));
      if (missing.missingOIDCClaims) grant!.addOIDCClaims(missing.missingOIDCClaims);
      const grantId = await grant!.save();
      await provider.interactionFinished(req, res, { consent: { grantId } }, { mergeWithLastSubmission: true });
    } catch (err) {
      next(err);
    }
  });

  app.post('/interaction/:uid/login', form, async (req, res, next) => {
    try {
      const details = await provider.interactionDetails(req, res);
      const login = String(req.body?.login ?? '');
      const account = findDemoAccount(login);
      if (!account || req.body?.password !== DEMO_PASSWORD) {
        res.status(401).type('html').send(signInPage({ action: `/interaction/${details.uid}/login`, clientName: 'Plyledger', login, error: 'Unknown user name or wrong password.' }));
        return;
      }
      await provider.interactionFinished(req, res, { login: { accountId: account.login } }, { mergeWithLastSubmission: false });
    } catch (err) {
      next(err);
    }
  });

  app.use('/interaction', ((err, _req, res, _next) => {
    res.status(400).type('html').send(errorPage('This sign-in request has expired or is not valid', (err as Error).message));
  }) as express.ErrorRequestHandler);

  app.use(provider.callback());

  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(options.port, '127.0.0.1', () => resolve(s));
    s.once('error', (err: NodeJS.ErrnoException) =>
      reject(err.code === 'EADDRINUSE' ? new Error(`auth-fake: port ${options.port} on 127.0.0.1 is taken; stop the other program or set PLYLEDGER_AUTH_FAKE_PORT`) : err),
    );
  });
  return {
    issuer: options.issuer,
    close: () => new Promise<void>((resolve) => { server.closeAllConnections(); server.close(() => resolve()); }),
  };
}

/** The options that match the API's configuration (same client, the API's callback). */
export function authFakeOptionsFor(config = loadConfig()): AuthFakeOptions {
  const app = config.appUrl.replace(/\/$/, '');
  const api = `http://127.0.0.1:${config.apiPort}`;
  return {
    issuer: config.oidc.issuer,
    port: config.authFakePort,
    clientId: config.oidc.clientId,
    clientSecret: config.oidc.clientSecret,
    redirectUris: [...new Set([`${app}/auth/callback`, `${api}/auth/callback`])],
    postLogoutRedirectUris: [...new Set([`${app}/`, `${api}/`])],
  };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const fake = await startAuthFake(authFakeOptionsFor());
  console.log(`[auth-fake] OpenID Connect provider at ${fake.issuer}`);
}
