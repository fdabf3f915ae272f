/**
 * The relying-party side of OpenID Connect (openid-client): discovery of the
 * configured issuer, done lazily and retried, so the API starts even while the
 * identity provider is not yet up. Plain-http issuers are accepted only on
 * loopback (the local stand-in); any other issuer must be https.
 */
import * as oidc from 'openid-client';
import type { Config } from '../config.ts';

export interface OidcClient {
  configuration: () => Promise<oidc.Configuration>;
}

export function isLoopbackUrl(url: URL): boolean {
  return ['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname);
}

export function createOidcClient(config: Config): OidcClient {
  let pending: Promise<oidc.Configuration> | undefined;
  const discover = async () => {
    const issuer = new URL(config.oidc.issuer);
    const insecure = issuer.protocol === 'http:';
    if (insecure && !isLoopbackUrl(issuer)) throw new Error(`the OpenID Connect issuer ${issuer} must use https (plain http is only for a loopback stand-in)`);
    return oidc.discovery(
      issuer,
      config.oidc.clientId,
      undefined,
      oidc.ClientSecretBasic(config.oidc.clientSecret),
      insecure ? { execute: [oidc.allowInsecureRequests], timeout: 5 } : { timeout: 5 },
    );
  };
  return {
    configuration() {
      pending ??= discover().catch((err) => {
        pending = undefined; // try again on the next sign-in
        throw err;
      });
      return pending;
    },
  };
}
