import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { SessionService } from '../../core/session/session';

/**
 * Shown when nobody is signed in (or the server cannot be reached). Signing in
 * leaves the application for the identity provider and returns to `returnTo`.
 */
@Component({
  selector: 'app-sign-in',
  imports: [MatButtonModule, MatIconModule, RouterLink],
  templateUrl: './sign-in.html',
  styleUrl: './sign-in.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SignInPage {
  protected readonly session = inject(SessionService);

  /** Query parameter set by the route guards: where the person wanted to go. */
  readonly returnTo = input<string>();

  protected readonly unreachableReason = computed(() => {
    const state = this.session.state();
    return state.status === 'unreachable' ? state.reason : null;
  });

  protected signIn(): void {
    this.session.signIn(this.returnTo() ?? '/');
  }

  protected async retry(): Promise<void> {
    await this.session.load();
  }
}
