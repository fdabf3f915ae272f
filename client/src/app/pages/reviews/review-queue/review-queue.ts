import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { catchError, map, of, startWith } from 'rxjs';

import { ReviewItem } from '../../../shared/catalogue/allowable-wire';
import { AllowablesApi } from '../../../shared/catalogue/allowables-api';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';

/** Proposed allowables waiting for a quality decision, oldest first; one's own proposals are another reviewer's. */
@Component({
  selector: 'app-review-queue',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule, QuantityUnitPipe, QuantityValuePipe, RouterLink],
  templateUrl: './review-queue.html',
  styleUrl: './review-queue.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewQueue {
  private readonly api = inject(AllowablesApi);

  protected readonly columns = ['group', 'value', 'method', 'proposed', 'action'];
  protected readonly queue = toSignal(
    this.api.reviewQueue().pipe(
      map((items) => ({ loading: false, items, failure: null })),
      catchError((error: unknown) => of({ loading: false, items: [] as readonly ReviewItem[], failure: catalogueFailureOf(error) })),
      startWith({ loading: true, items: null as readonly ReviewItem[] | null, failure: null }),
    ),
    { initialValue: { loading: true, items: null, failure: null } },
  );
}
