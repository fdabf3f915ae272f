import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';

import { mayOpen, PageAudience } from './page-access';
import { SessionService } from './session';
import { signInPage } from './signed-in-guard';

/**
 * Opens a page for holders of the roles in the route's `data.audience`
 * (see PAGE_AUDIENCE); signed-in people without them see the not-permitted page.
 */
export const roleGuard: CanActivateFn = (route, state) => {
  const session = inject(SessionService);
  const router = inject(Router);
  if (!session.isSignedIn()) {
    return signInPage(router, state.url);
  }
  const audience = (route.data['audience'] as PageAudience | undefined) ?? 'signed-in';
  return mayOpen(audience, session.roles()) || router.createUrlTree(['/not-permitted']);
};
