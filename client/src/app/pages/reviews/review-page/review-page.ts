import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { catchError, combineLatest, map, of, startWith, switchMap } from 'rxjs';

import { SessionService } from '../../../core/session/session';
import { AllowableDetail, Decision } from '../../../shared/catalogue/allowable-wire';
import { AllowablesApi } from '../../../shared/catalogue/allowables-api';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { EngineeringCaution } from '../../../shared/engineering-caution/engineering-caution';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { AnalysisView } from '../../analyses/analysis-view/analysis-view';
import { AllowableChain } from '../../allowables/allowable-chain/allowable-chain';
import { AllowableFacts } from '../../allowables/allowable-facts/allowable-facts';
import { AllowableHistory } from '../../allowables/allowable-history/allowable-history';
import { DecisionDialog, DecisionDialogData } from '../decision-dialog/decision-dialog';

interface ReviewState {
  readonly loading: boolean;
  readonly allowable: AllowableDetail | null;
  readonly failure: ApiFailure | null;
}

/**
 * One proposal under review (the reviewers' e-mail links here): the value,
 * its analysis with the data and diagnostics, the chain and the revisions,
 * and the signed decision.
 */
@Component({
  selector: 'app-review-page',
  imports: [
    AllowableChain,
    AllowableFacts,
    AllowableHistory,
    AnalysisView,
    EngineeringCaution,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    RouterLink,
  ],
  templateUrl: './review-page.html',
  styleUrl: './review-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewPage {
  private readonly api = inject(AllowablesApi);
  private readonly dialog = inject(MatDialog);
  private readonly session = inject(SessionService);

  /** The route's :id. */
  readonly id = input.required<string>();
  private readonly reloadCount = signal(0);
  protected readonly justDecided = signal<Decision | null>(null);

  protected readonly state = toSignal(
    combineLatest([toObservable(this.id), toObservable(this.reloadCount)]).pipe(
      switchMap(([id]) =>
        this.api.allowable(Number(id)).pipe(
          map((allowable): ReviewState => ({ loading: false, allowable, failure: null })),
          catchError((error: unknown) => of<ReviewState>({ loading: false, allowable: null, failure: catalogueFailureOf(error) })),
          startWith<ReviewState>({ loading: true, allowable: null, failure: null }),
        ),
      ),
    ),
    { initialValue: { loading: true, allowable: null, failure: null } as ReviewState },
  );

  protected readonly ownProposal = computed(() => this.state().allowable?.proposer.id === this.session.user()?.id);
  protected readonly mayDecide = computed(() => this.state().allowable?.status === 'proposed' && !this.ownProposal());

  protected decide(allowable: AllowableDetail, decision: Decision): void {
    this.dialog
      .open<DecisionDialog, DecisionDialogData, AllowableDetail>(DecisionDialog, { data: { allowable, decision }, width: '620px' })
      .afterClosed()
      .subscribe((decided) => {
        if (!decided) return;
        this.justDecided.set(decision);
        this.reloadCount.update((n) => n + 1);
      });
  }
}
