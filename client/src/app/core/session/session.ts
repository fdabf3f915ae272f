import { DOCUMENT } from '@angular/common';
import { HttpClient, HttpContext, HttpContextToken, HttpErrorResponse } from '@angular/common/http';
import { computed, inject, Injectable, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import { isRole, Role } from './roles';
import { currentPath, signInUrl } from './sign-in-url';

/** The person as GET /api/v1/me returns them. */
export interface SignedInUser {
  readonly id: number;
  readonly subject: string;
  readonly name: string;
  readonly email: string | null;
}

interface MeReply {
  readonly user: SignedInUser;
  readonly roles: readonly string[];
}

interface SignOutReply {
  readonly redirectTo: string;
}

export type SessionState =
  | { readonly status: 'unknown' }
  | { readonly status: 'signed-out' }
  | { readonly status: 'signed-in'; readonly user: SignedInUser; readonly roles: readonly Role[] }
  | { readonly status: 'unreachable'; readonly reason: string };

/**
 * Marks the session probe: its 401 only means "not signed in yet", so the auth
 * interceptor must not turn it into a redirect.
 */
export const SESSION_PROBE = new HttpContextToken<boolean>(() => false);

const ME_URL = '/api/v1/me';
const SIGN_OUT_URL = '/auth/logout';

/** Who is signed in, with which roles; sign-in and sign-out. */
@Injectable({ providedIn: 'root' })
export class SessionService {
  private readonly http = inject(HttpClient);
  private readonly document = inject(DOCUMENT);
  private readonly stateSignal = signal<SessionState>({ status: 'unknown' });

  readonly state = this.stateSignal.asReadonly();
  readonly isSignedIn = computed(() => this.stateSignal().status === 'signed-in');
  readonly user = computed(() => {
    const state = this.stateSignal();
    return state.status === 'signed-in' ? state.user : null;
  });
  readonly roles = computed<readonly Role[]>(() => {
    const state = this.stateSignal();
    return state.status === 'signed-in' ? state.roles : [];
  });

  /** Asks the API who is signed in. Never rejects: failures become a state. */
  async load(): Promise<void> {
    try {
      const reply = await firstValueFrom(
        this.http.get<MeReply>(ME_URL, { context: new HttpContext().set(SESSION_PROBE, true) }),
      );
      this.stateSignal.set({
        status: 'signed-in',
        user: reply.user,
        roles: reply.roles.filter(isRole),
      });
    } catch (error) {
      this.stateSignal.set(stateAfterProbeError(error));
    }
  }

  /** Leaves the application for the identity provider; it returns to `returnTo`. */
  signIn(returnTo: string = currentPath(this.document.location)): void {
    this.document.location.assign(signInUrl(returnTo));
  }

  /**
   * Ends the session on the API (the XSRF header is added by HttpClient) and
   * follows the API's redirect. Rejects when the API refused, so the caller can say so.
   */
  async signOut(): Promise<void> {
    const reply = await firstValueFrom(this.http.post<SignOutReply>(SIGN_OUT_URL, {}));
    this.stateSignal.set({ status: 'signed-out' });
    this.document.location.assign(reply.redirectTo || '/');
  }
}

function stateAfterProbeError(error: unknown): SessionState {
  if (error instanceof HttpErrorResponse && error.status === 401) {
    return { status: 'signed-out' };
  }
  const reason =
    error instanceof HttpErrorResponse && error.status !== 0
      ? `the server answered ${error.status} ${error.statusText}`.trim()
      : 'the server did not answer';
  return { status: 'unreachable', reason };
}
