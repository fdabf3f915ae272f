import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import { AllowableStatus } from '../../../shared/catalogue/allowable-wire';

const LABELS: Readonly<Record<AllowableStatus, string>> = {
  draft: 'draft',
  proposed: 'proposed, awaiting review',
  approved: 'approved',
  rejected: 'rejected',
  superseded: 'superseded',
};

/** The status of an allowable as a small coloured label. */
@Component({
  selector: 'app-status-chip',
  template: `<span [class]="'chip chip-' + status()" [attr.data-status]="status()">{{ labels[status()] }}</span>`,
  styleUrl: './status-chip.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StatusChip {
  readonly status = input.required<AllowableStatus>();
  protected readonly labels = LABELS;
}
