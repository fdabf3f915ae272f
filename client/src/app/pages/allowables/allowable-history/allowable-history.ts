import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { RouterLink } from '@angular/router';

import { Allowable } from '../../../shared/catalogue/allowable-wire';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';
import { StatusChip } from '../status-chip/status-chip';

/** Every revision of an allowable, newest first: approved values are never changed, only superseded. */
@Component({
  selector: 'app-allowable-history',
  imports: [DatePipe, QuantityUnitPipe, QuantityValuePipe, RouterLink, StatusChip],
  templateUrl: './allowable-history.html',
  styleUrl: './allowable-history.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllowableHistory {
  readonly history = input.required<readonly Allowable[]>();
  /** The revision on the page, marked in the list. */
  readonly currentId = input<number | null>(null);
}
