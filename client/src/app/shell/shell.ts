import { BreakpointObserver } from '@angular/cdk/layout';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  ElementRef,
  inject,
  linkedSignal,
  signal,
  viewChild,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { map } from 'rxjs';

import { SessionService } from '../core/session/session';
import { UnitSystem, UnitSystemService } from '../core/units/unit-system';
import { navItemsFor } from './nav-items';

/** Below this width the side navigation floats over the page instead of beside it. */
const NARROW_SCREEN = '(max-width: 959.98px)';

/** Toolbar, side navigation by role, the routed page and the footer. */
@Component({
  selector: 'app-shell',
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    MatIconModule,
    MatListModule,
    MatSidenavModule,
    MatToolbarModule,
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  protected readonly session = inject(SessionService);
  protected readonly units = inject(UnitSystemService);

  protected readonly narrowScreen = toSignal(
    inject(BreakpointObserver)
      .observe(NARROW_SCREEN)
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  /** Open beside the page on wide screens; closed (until asked for) on narrow ones. */
  protected readonly navOpen = linkedSignal(() => !this.narrowScreen());
  protected readonly navItems = computed(() => navItemsFor(this.session.roles()));
  protected readonly signingOut = signal(false);
  protected readonly signOutFailed = signal(false);

  private readonly main = viewChild.required<ElementRef<HTMLElement>>('main');

  protected toggleNav(): void {
    this.navOpen.update((open) => !open);
  }

  protected afterNavClick(): void {
    if (this.narrowScreen()) {
      this.navOpen.set(false);
    }
  }

  protected setUnitSystem(system: UnitSystem): void {
    this.units.set(system);
  }

  protected skipToMain(): void {
    this.main().nativeElement.focus();
  }

  protected async signOut(): Promise<void> {
    this.signingOut.set(true);
    this.signOutFailed.set(false);
    try {
      await this.session.signOut();
    } catch {
      this.signOutFailed.set(true);
      this.signingOut.set(false);
    }
  }
}
