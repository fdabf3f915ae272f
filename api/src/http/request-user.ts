import 'express-session';
import type { RoleCode } from '../users/roles.ts';

/** What a signed-in session carries; the roles are the identity provider's, as at sign-in. */
export interface SessionUser {
  id: number;
  name: string;
  email: string | null;
  roles: RoleCode[];
}

declare module 'express-session' {
  interface SessionData {
    user?: SessionUser;
    /** Sign-in in progress: PKCE verifier, state and where to go afterwards. */
    signIn?: { codeVerifier: string; state: string; nonce: string; returnTo: string };
    /** ID token of the sign-in, sent back to the provider as id_token_hint at sign-out. */
    idToken?: string;
    csrfToken?: string;
  }
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set by requireSession. */
      user?: SessionUser;
    }
  }
}
