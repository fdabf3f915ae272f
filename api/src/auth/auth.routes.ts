/**
 * Sign-in and sign-out through OpenID Connect: the authorisation code flow with
 * PKCE. /auth/login sends the browser to the provider; /auth/callback takes the
 * code back, checks state and nonce, reads the user and their roles from the ID
 * token (or userinfo when the token lacks the roles claim), and starts a fresh
 * session; /auth/logout (POST, CSRF-protected) ends it and returns the
 * provider's end-session URL.
 */
import { Router, type Request, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import * as oidc from 'openid-client';
import { audit } from '../audit/audit.service.ts';
import type { Config } from '../config.ts';
import { ApiError } from '../http/errors.ts';
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { signInUser } from '../users/users.service.ts';
import type { OidcClient } from './oidc-client.ts';
import { SESSION_COOKIE } from './session.ts';

/** Only same-application paths are accepted as a place to return to (no open redirect). */
export function safeReturnTo(value: unknown): string {
  return typeof value === 'string' && /^\/(?![/\\])[^\s]*$/.test(value) && !value.startsWith('/auth/') ? value : '/';
}

const promisify = (fn: (cb: (err?: unknown) => void) => void) => new Promise<void>((resolve, reject) => fn((err) => (err ? reject(err) : resolve())));

export function authRouter(deps: { db: Knex; config: Config; oidc: OidcClient; csrf: { protect: RequestHandler; issueToken: RequestHandler } }): Router {
  const { db, config } = deps;
  const router = Router();
  const callbackUrl = new URL('/auth/callback', config.appUrl).href;

  const providerUnavailable = (err: unknown) =>
    new ApiError(503, 'identity_provider_unavailable', `The identity provider at ${config.oidc.issuer} cannot be reached right now; try again shortly`, {
      reason: (err as Error).message,
    });

  router.get('/login', async (req, res) => {
    let configuration: oidc.Configuration;
    try {
      configuration = await deps.oidc.configuration();
    } catch (err) {
      throw providerUnavailable(err);
    }
    const codeVerifier = oidc.randomPKCECodeVerifier();
    const state = oidc.randomState();
    const nonce = oidc.randomNonce();
    req.session.signIn = { codeVerifier, state, nonce, returnTo: safeReturnTo(req.query.returnTo) };
    await promisify((cb) => req.session.save(cb));
    const url = oidc.buildAuthorizationUrl(configuration, {
      redirect_uri: callbackUrl,
      scope: config.oidc.scopes,
      code_challenge: await oidc.calculatePKCECodeChallenge(codeVerifier),
      code_challenge_method: 'S256',
      state,
      nonce,
    });
    res.redirect(url.href);
  });

  router.get('/callback', async (req: Request, res) => {
    const pending = req.session.signIn;
    if (!pending) throw new ApiError(400, 'sign_in_expired', 'This sign-in was not started here or has expired; start again at /auth/login');
    const configuration = await deps.oidc.configuration().catch((err) => { throw providerUnavailable(err); });
    let tokens: Awaited<ReturnType<typeof oidc.authorizationCodeGrant>>;
    try {
      tokens = await oidc.authorizationCodeGrant(configuration, new URL(req.originalUrl, callbackUrl), {
        pkceCodeVerifier: pending.codeVerifier,
        expectedState: pending.state,
        expectedNonce: pending.nonce,
        idTokenExpected: true,
      });
    } catch (err) {
      throw new ApiError(401, 'sign_in_failed', 'The identity provider did not confirm this sign-in; start again at /auth/login', { reason: (err as Error).message });
    }
    const claims = tokens.claims()!;
    let roles: unknown = claims[config.oidc.rolesClaim];
    let profile: Record<string, unknown> = claims;
    if (roles === undefined && tokens.access_token) {
      profile = await oidc.fetchUserInfo(configuration, tokens.access_token, claims.sub);
      roles = profile[config.oidc.rolesClaim];
    }
    const user = await signInUser(db, {
      issuer: String(claims.iss),
      subject: claims.sub,
      name: (profile.name ?? claims.name) as string | undefined,
      email: (profile.email ?? claims.email ?? null) as string | null,
      roles,
    });
    // A new session id at sign-in, so an id planted before it is worthless afterwards.
    await promisify((cb) => req.session.regenerate(cb));
    req.session.user = user;
    req.session.idToken = tokens.id_token;
    deps.csrf.issueToken(req, res, () => undefined);
    await promisify((cb) => req.session.save(cb));
    await audit(db, user, { action: 'user.signed-in', entityType: 'user', entityId: user.id, details: { roles: user.roles } });
    res.redirect(pending.returnTo);
  });

  router.post('/logout', deps.csrf.protect, async (req, res) => {
    const user = req.session.user;
    const idToken = req.session.idToken;
    let redirectTo = '/';
    try {
      const configuration = await deps.oidc.configuration();
      if (configuration.serverMetadata().end_session_endpoint) {
        redirectTo = oidc.buildEndSessionUrl(configuration, {
          post_logout_redirect_uri: new URL('/', config.appUrl).href,
          ...(idToken ? { id_token_hint: idToken } : {}),
        }).href;
      }
    } catch {
      // The provider is unreachable: the Plyledger session still ends.
    }
    await promisify((cb) => req.session.destroy(cb));
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.clearCookie('XSRF-TOKEN', { path: '/' });
    if (user) await audit(db, user, { action: 'user.signed-out', entityType: 'user', entityId: user.id });
    res.json({ redirectTo });
  });

  return router;
}

export const authOpenApi: OpenApiFragment = {
  paths: {
    '/auth/login': {
      get: {
        summary: 'Start sign-in: redirects to the identity provider (authorisation code flow with PKCE)',
        tags: ['auth'],
        'x-public': true,
        parameters: [{ name: 'returnTo', in: 'query', schema: { type: 'string' }, description: 'application path to return to' }],
        responses: { 302: { description: 'Redirect to the identity provider' }, 503: { $ref: '#/components/responses/Error' } },
      },
    },
    '/auth/callback': {
      get: {
        summary: 'Where the identity provider sends the browser back with the code',
        tags: ['auth'],
        'x-public': true,
        responses: { 302: { description: 'Signed in; redirect to returnTo' }, 400: { $ref: '#/components/responses/Error' }, 401: { $ref: '#/components/responses/Error' } },
      },
    },
    '/auth/logout': {
      post: {
        summary: 'Sign out: ends the session and returns the provider\'s end-session URL',
        tags: ['auth'],
        'x-public': true,
        responses: {
          200: { description: 'Signed out', content: { 'application/json': { schema: { type: 'object', properties: { redirectTo: { type: 'string' } } } } } },
          403: { $ref: '#/components/responses/Error' },
        },
      },
    },
  },
};
