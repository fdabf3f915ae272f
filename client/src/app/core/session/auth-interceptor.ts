import { DOCUMENT } from '@angular/common';
import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { catchError, throwError } from 'rxjs';

import { SESSION_PROBE } from './session';
import { currentPath, signInUrl } from './sign-in-url';

/**
 * A 401 from the API means the session has ended (expired or signed out in
 * another tab): send the person to sign in and bring them back here. The
 * session probe is exempt, its 401 just means "not signed in yet".
 */
export const authInterceptor: HttpInterceptorFn = (request, next) => {
  const document = inject(DOCUMENT);
  return next(request).pipe(
    catchError((error: unknown) => {
      const sessionEnded =
        error instanceof HttpErrorResponse &&
        error.status === 401 &&
        isApiUrl(request.url) &&
        !request.context.get(SESSION_PROBE);
      if (sessionEnded) {
        document.location.assign(signInUrl(currentPath(document.location)));
      }
      return throwError(() => error);
    }),
  );
};

function isApiUrl(url: string): boolean {
  return url.startsWith('/api/');
}
