import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import { Approval } from '../../data/layup-wire';

const BADGES: Readonly<Record<Approval, { icon: string; text: string; tone: 'good' | 'warn' | 'bad' }>> = {
  approved: { icon: 'verified', text: 'Approved allowables', tone: 'good' },
  'partly-approved': { icon: 'rule', text: 'Partly approved: some strengths are not approved', tone: 'warn' },
  unapproved: { icon: 'gpp_maybe', text: 'Unapproved values', tone: 'bad' },
  typical: { icon: 'science', text: 'Typical values, not allowables', tone: 'warn' },
};

/** How far the lamina data a ply is computed on are approved, as a badge that cannot be missed. */
@Component({
  selector: 'app-lamina-badge',
  imports: [MatIconModule],
  template: `
    <span class="badge" [class]="badge().tone" [attr.data-approval]="approval()" data-testid="lamina-badge">
      <mat-icon aria-hidden="true">{{ badge().icon }}</mat-icon>
      {{ label() ? label() + ': ' : '' }}{{ badge().text }}
    </span>
  `,
  styleUrl: './lamina-badge.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LaminaBadge {
  readonly approval = input.required<Approval>();
  readonly label = input('');

  protected readonly badge = computed(() => BADGES[this.approval()]);
}
