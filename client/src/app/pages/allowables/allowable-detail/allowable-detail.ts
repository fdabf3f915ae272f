import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { catchError, combineLatest, map, Observable, of, startWith, switchMap } from 'rxjs';

import { SessionService } from '../../../core/session/session';
import { AllowableDetail } from '../../../shared/catalogue/allowable-wire';
import { AllowablesApi } from '../../../shared/catalogue/allowables-api';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { EngineeringCaution } from '../../../shared/engineering-caution/engineering-caution';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { ProblemList } from '../../../shared/problem-list/problem-list';
import { AnalysisView } from '../../analyses/analysis-view/analysis-view';
import { AllowableChain } from '../allowable-chain/allowable-chain';
import { AllowableFacts } from '../allowable-facts/allowable-facts';
import { AllowableHistory } from '../allowable-history/allowable-history';
import { AllowableImpact } from '../allowable-impact/allowable-impact';

interface DetailState {
  readonly loading: boolean;
  readonly allowable: AllowableDetail | null;
  readonly failure: ApiFailure | null;
}

/**
 * One allowable: its value and decision, the caution beside an approved
 * value, its revision history, the chain back to analysis, coupons and
 * upload, what used it, and the e-mails sent about it. The link in the
 * proposer's decision e-mail opens this page.
 */
@Component({
  selector: 'app-allowable-detail',
  imports: [
    AllowableChain,
    AllowableFacts,
    AllowableHistory,
    AllowableImpact,
    AnalysisView,
    DatePipe,
    EngineeringCaution,
    MatButtonModule,
    MatExpansionModule,
    MatIconModule,
    MatProgressBarModule,
    ProblemList,
    RouterLink,
  ],
  templateUrl: './allowable-detail.html',
  styleUrl: './allowable-detail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllowableDetailPage {
  private readonly api = inject(AllowablesApi);
  private readonly router = inject(Router);
  private readonly session = inject(SessionService);

  /** The route's :id. */
  readonly id = input.required<string>();
  private readonly reloadCount = signal(0);
  protected readonly acting = signal(false);
  protected readonly actionFailure = signal<ApiFailure | null>(null);

  protected readonly state = toSignal(
    combineLatest([toObservable(this.id), toObservable(this.reloadCount)]).pipe(
      switchMap(([id]) =>
        this.api.allowable(Number(id)).pipe(
          map((allowable): DetailState => ({ loading: false, allowable, failure: null })),
          catchError((error: unknown) => of<DetailState>({ loading: false, allowable: null, failure: catalogueFailureOf(error) })),
          startWith<DetailState>({ loading: true, allowable: null, failure: null }),
        ),
      ),
    ),
    { initialValue: { loading: true, allowable: null, failure: null } as DetailState },
  );

  /** The author of a draft sends it to review or withdraws it. */
  protected readonly ownDraft = computed(() => {
    const allowable = this.state().allowable;
    return allowable?.status === 'draft' && allowable.proposer.id === this.session.user()?.id;
  });
  protected readonly mayReview = computed(() => this.state().allowable?.status === 'proposed' && this.session.roles().includes('quality'));

  protected submitDraft(id: number): void {
    this.act(this.api.submitDraft(id), () => this.reloadCount.update((n) => n + 1));
  }

  protected withdrawDraft(id: number): void {
    this.act(this.api.withdrawDraft(id), () => void this.router.navigate(['/allowables']));
  }

  private act(request: Observable<unknown>, done: () => void): void {
    this.acting.set(true);
    this.actionFailure.set(null);
    request.subscribe({
      next: () => {
        this.acting.set(false);
        done();
      },
      error: (error: unknown) => {
        this.acting.set(false);
        this.actionFailure.set(catalogueFailureOf(error));
      },
    });
  }
}
