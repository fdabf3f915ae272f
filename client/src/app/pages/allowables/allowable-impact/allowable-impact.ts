import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { RouterLink } from '@angular/router';
import { catchError, map, of, startWith, switchMap } from 'rxjs';

import { AllowableImpact as Impact } from '../../../shared/catalogue/allowable-wire';
import { AllowablesApi } from '../../../shared/catalogue/allowables-api';

/**
 * The layup revisions and section exports that used this allowable
 * (GET /allowables/:id/impact): when it is superseded, nobody should keep
 * designing on it unawares.
 */
@Component({
  selector: 'app-allowable-impact',
  imports: [DatePipe, RouterLink],
  templateUrl: './allowable-impact.html',
  styleUrl: './allowable-impact.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllowableImpact {
  private readonly api = inject(AllowablesApi);

  readonly allowableId = input.required<number>();
  /** superseded or rejected: the list is then a warning. */
  readonly withdrawn = input(false);

  protected readonly impact = toSignal(
    toObservable(this.allowableId).pipe(
      switchMap((id) =>
        this.api.impact(id).pipe(
          map((impact) => ({ impact, failed: false })),
          catchError(() => of({ impact: null as Impact | null, failed: true })),
          startWith({ impact: null as Impact | null, failed: false }),
        ),
      ),
    ),
    { initialValue: { impact: null as Impact | null, failed: false } },
  );
}
