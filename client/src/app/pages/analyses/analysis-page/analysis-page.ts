import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import { catchError, combineLatest, map, of, startWith, switchMap } from 'rxjs';

import { SessionService } from '../../../core/session/session';
import { Allowable, AllowableDetail } from '../../../shared/catalogue/allowable-wire';
import { AllowablesApi } from '../../../shared/catalogue/allowables-api';
import { AnalysesApi } from '../../../shared/catalogue/analyses-api';
import { AnalysisDetail, QUANTITY_LABELS } from '../../../shared/catalogue/analysis-wire';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { AnalysisView } from '../analysis-view/analysis-view';
import { OverrideDialog } from '../override-dialog/override-dialog';
import { ProposeDialog } from '../propose-dialog/propose-dialog';

interface PageState {
  readonly loading: boolean;
  readonly analysis: AnalysisDetail | null;
  readonly allowables: readonly Allowable[];
  readonly failure: ApiFailure | null;
}

/**
 * One stored analysis with what a materials engineer does next: choose
 * another method (with a reason), or propose an allowable from it.
 */
@Component({
  selector: 'app-analysis-page',
  imports: [AnalysisView, DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, QuantityUnitPipe, QuantityValuePipe, RouterLink],
  templateUrl: './analysis-page.html',
  styleUrl: './analysis-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AnalysisPage {
  private readonly analyses = inject(AnalysesApi);
  private readonly allowablesApi = inject(AllowablesApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly session = inject(SessionService);

  /** The route's :id. */
  readonly id = input.required<string>();
  protected readonly quantityLabels = QUANTITY_LABELS;
  protected readonly mayAct = computed(() => this.session.roles().includes('materials-engineer'));
  private readonly reloadCount = signal(0);

  protected readonly state = toSignal(
    combineLatest([toObservable(this.id), toObservable(this.reloadCount)]).pipe(
      switchMap(([id]) =>
        combineLatest([
          this.analyses.analysis(Number(id)),
          this.allowablesApi.list({ analysis: Number(id) }).pipe(
            map((reply) => reply.items),
            catchError(() => of([] as readonly Allowable[])),
          ),
        ]).pipe(
          map(([analysis, allowables]): PageState => ({ loading: false, analysis, allowables, failure: null })),
          catchError((error: unknown) => of<PageState>({ loading: false, analysis: null, allowables: [], failure: catalogueFailureOf(error) })),
          startWith<PageState>({ loading: true, analysis: null, allowables: [], failure: null }),
        ),
      ),
    ),
    { initialValue: { loading: true, analysis: null, allowables: [], failure: null } as PageState },
  );

  protected chooseMethod(analysis: AnalysisDetail): void {
    this.dialog
      .open<OverrideDialog, AnalysisDetail, AnalysisDetail>(OverrideDialog, { data: analysis, width: '560px' })
      .afterClosed()
      .subscribe((created) => {
        if (created) void this.router.navigate(['/test-data/analyses', created.id]);
      });
  }

  protected propose(analysis: AnalysisDetail): void {
    this.dialog
      .open<ProposeDialog, AnalysisDetail, AllowableDetail>(ProposeDialog, { data: analysis, width: '600px' })
      .afterClosed()
      .subscribe((allowable) => {
        if (allowable) void this.router.navigate(['/allowables', allowable.id]);
      });
  }
}
