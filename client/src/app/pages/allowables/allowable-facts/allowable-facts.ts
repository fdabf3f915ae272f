import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { RouterLink } from '@angular/router';

import { mayOpen, PAGE_AUDIENCE } from '../../../core/session/page-access';
import { SessionService } from '../../../core/session/session';
import { Allowable } from '../../../shared/catalogue/allowable-wire';
import { METHOD_LABELS, ReportedMethod } from '../../../shared/catalogue/analysis-wire';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';
import { StatusChip } from '../status-chip/status-chip';

/**
 * What an allowable is and where it stands: the value at its basis, the data
 * group, the method and analysis, the proposal, and the signed decision
 * (signer, time and the meaning of the signature).
 */
@Component({
  selector: 'app-allowable-facts',
  imports: [DatePipe, QuantityUnitPipe, QuantityValuePipe, RouterLink, StatusChip],
  templateUrl: './allowable-facts.html',
  styleUrl: './allowable-facts.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllowableFacts {
  private readonly session = inject(SessionService);

  readonly allowable = input.required<Allowable>();

  /** The analysis page is under Test data; others read the analysis on this page. */
  protected readonly mayOpenAnalysis = computed(() => mayOpen(PAGE_AUDIENCE['test-data'], this.session.roles()));
  protected readonly methodLabel = computed(() => METHOD_LABELS[this.allowable().method as ReportedMethod] ?? this.allowable().method);
}
