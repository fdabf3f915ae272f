import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { catchError, map, of, startWith } from 'rxjs';

import { SessionService } from '../../../core/session/session';
import { AnalysesApi } from '../../../shared/catalogue/analyses-api';
import { AnalysisSummary, METHOD_LABELS } from '../../../shared/catalogue/analysis-wire';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';

/** The latest stored analyses, newest first. */
@Component({
  selector: 'app-analysis-list',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule, QuantityUnitPipe, QuantityValuePipe, RouterLink],
  templateUrl: './analysis-list.html',
  styleUrl: './analysis-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AnalysisList {
  private readonly api = inject(AnalysesApi);
  private readonly session = inject(SessionService);

  protected readonly mayRun = computed(() => this.session.roles().includes('materials-engineer'));
  protected readonly methodLabels = METHOD_LABELS;
  protected readonly columns = ['id', 'group', 'quantity', 'n', 'method', 'bBasis', 'aBasis', 'created'];

  protected readonly list = toSignal(
    this.api.recent({ limit: 50 }).pipe(
      map((items) => ({ loading: false, items, failure: null })),
      catchError((error: unknown) => of({ loading: false, items: [] as readonly AnalysisSummary[], failure: catalogueFailureOf(error) })),
      startWith({ loading: true, items: null, failure: null }),
    ),
    { initialValue: { loading: true, items: null, failure: null } },
  );

  protected methodLabel(a: AnalysisSummary): string {
    return this.methodLabels[a.methodUsed];
  }

  protected conditionsOf(a: AnalysisSummary): string {
    return a.conditions.map((c) => c.code).join(' + ');
  }
}
