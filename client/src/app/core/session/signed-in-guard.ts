import { inject } from '@angular/core';
import { CanActivateFn, Router, UrlTree } from '@angular/router';

import { SessionService } from './session';

/** Pages for people who are signed in; anyone else goes to the sign-in page. */
export const signedInGuard: CanActivateFn = (_route, state) =>
  inject(SessionService).isSignedIn() || signInPage(inject(Router), state.url);

/** The sign-in page, remembering where the person wanted to go. */
export function signInPage(router: Router, returnTo: string): UrlTree {
  return router.createUrlTree(['/sign-in'], { queryParams: { returnTo } });
}
