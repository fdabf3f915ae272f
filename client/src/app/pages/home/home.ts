import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { ROLE_LABELS } from '../../core/session/roles';
import { SessionService } from '../../core/session/session';
import { EngineeringCaution } from '../../shared/engineering-caution/engineering-caution';
import { navItemsFor } from '../../shell/nav-items';

/** Greets the person, says what their roles let them do, and shows the caution. */
@Component({
  selector: 'app-home',
  imports: [EngineeringCaution, MatIconModule, RouterLink],
  templateUrl: './home.html',
  styleUrl: './home.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HomePage {
  private readonly session = inject(SessionService);

  protected readonly user = this.session.user;
  protected readonly roleNames = computed(() =>
    this.session.roles().map((role) => ROLE_LABELS[role]),
  );
  protected readonly destinations = computed(() =>
    navItemsFor(this.session.roles()).filter((item) => item.key !== 'home'),
  );
}
