import {
  provideHttpClient,
  withInterceptors,
  withXsrfConfiguration,
} from '@angular/common/http';
import {
  ApplicationConfig,
  inject,
  provideAppInitializer,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import { provideRouter, TitleStrategy, withComponentInputBinding } from '@angular/router';

import { routes } from './app.routes';
import { authInterceptor } from './core/session/auth-interceptor';
import { SessionService } from './core/session/session';
import { PageTitleStrategy } from './core/page-title-strategy';

export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(routes, withComponentInputBinding()),
    { provide: TitleStrategy, useClass: PageTitleStrategy },
    provideHttpClient(
      withInterceptors([authInterceptor]),
      // The API sets the readable XSRF-TOKEN cookie and checks this header on
      // every state-changing request; HttpClient adds it to relative URLs.
      withXsrfConfiguration({ cookieName: 'XSRF-TOKEN', headerName: 'X-XSRF-TOKEN' }),
    ),
    // The route guards need to know who is signed in before the first navigation.
    provideAppInitializer(() => inject(SessionService).load()),
  ],
};
