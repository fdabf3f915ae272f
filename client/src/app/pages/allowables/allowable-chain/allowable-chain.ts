import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { RouterLink } from '@angular/router';

import { mayOpen, PAGE_AUDIENCE } from '../../../core/session/page-access';
import { SessionService } from '../../../core/session/session';
import { AllowableDetail } from '../../../shared/catalogue/allowable-wire';
import { CouponsApi } from '../../../shared/catalogue/coupons-api';

/**
 * The chain behind an allowable: the analysis it cites, the coupons that
 * analysis was run on (and how many are excluded now), and the uploads those
 * coupons came from, each with its checksum and the stored file.
 */
@Component({
  selector: 'app-allowable-chain',
  imports: [DatePipe, DecimalPipe, RouterLink],
  templateUrl: './allowable-chain.html',
  styleUrl: './allowable-chain.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllowableChain {
  private readonly coupons = inject(CouponsApi);
  private readonly session = inject(SessionService);

  readonly allowable = input.required<AllowableDetail>();

  protected readonly mayOpenTestData = computed(() => mayOpen(PAGE_AUDIENCE['test-data'], this.session.roles()));
  protected readonly analysis = computed(() => this.allowable().chain.analysis);
  protected readonly excludedNow = computed(() => this.allowable().chain.coupons.filter((c) => c.status === 'excluded').length);
  protected readonly batches = computed(() => new Set(this.allowable().chain.coupons.map((c) => c.batch)).size);

  protected fileUrl(uploadId: number): string {
    return this.coupons.storedFileUrl(uploadId);
  }
}
