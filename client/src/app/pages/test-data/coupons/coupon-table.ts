import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { catchError, combineLatest, map, of, startWith, switchMap } from 'rxjs';

import { SessionService } from '../../../core/session/session';
import { DisplayValuePipe, UnitLabelPipe } from '../../../core/units/display-value-pipe';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { Specimen, SpecimenPage, SpecimenQuery, SpecimenSortKey } from '../../../shared/catalogue/coupon-wire';
import { CouponsApi } from '../../../shared/catalogue/coupons-api';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { CouponFilter, CouponFilters, NO_FILTER } from './coupon-filters';
import { StatusDialog, StatusDialogData } from './status-dialog';

interface TableState {
  readonly loading: boolean;
  readonly page: SpecimenPage | null;
  readonly failure: ApiFailure | null;
}

const SORT_KEYS: readonly SpecimenSortKey[] = ['specimenCode', 'testDate', 'strengthMpa', 'modulusMpa', 'thicknessMm', 'widthMm', 'status', 'batch', 'condition', 'uploadedAt'];

function numberParam(value: string | null): number | null {
  const n = Number(value);
  return value !== null && Number.isInteger(n) && n > 0 ? n : null;
}

/**
 * Every stored coupon, paged, sorted and filtered on the server. Materials
 * engineers exclude a coupon from analyses, or restore it, with a reason.
 */
@Component({
  selector: 'app-coupon-table',
  imports: [
    CouponFilters,
    DatePipe,
    DisplayValuePipe,
    MatButtonModule,
    MatIconModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSortModule,
    MatTableModule,
    RouterLink,
    UnitLabelPipe,
  ],
  templateUrl: './coupon-table.html',
  styleUrl: './coupon-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CouponTable {
  private readonly api = inject(CouponsApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly session = inject(SessionService);

  protected readonly mayChangeStatus = computed(() => this.session.roles().includes('materials-engineer'));
  protected readonly columns = computed(() => [
    'specimenCode', 'batch', 'condition', 'property', 'thicknessMm', 'widthMm',
    'strengthMpa', 'modulusMpa', 'failureStrain', 'testDate', 'status',
    ...(this.mayChangeStatus() ? ['actions'] : []),
  ]);

  protected readonly initialFilter = this.readFilterFromUrl();
  private readonly filter = signal<CouponFilter>(this.initialFilter);
  protected readonly sort = signal<{ key: SpecimenSortKey; order: 'asc' | 'desc' }>({ key: 'specimenCode', order: 'asc' });
  protected readonly paging = signal({ page: 1, pageSize: 50 });
  private readonly reloadCount = signal(0);

  private readonly query = computed<SpecimenQuery>(() => ({
    ...this.filter(),
    sort: this.sort().key,
    order: this.sort().order,
    ...this.paging(),
  }));

  protected readonly state = toSignal(
    combineLatest([toObservable(this.query), toObservable(this.reloadCount)]).pipe(
      switchMap(([query]) =>
        this.api.specimens(query).pipe(
          map((page): TableState => ({ loading: false, page, failure: null })),
          catchError((error: unknown) => of<TableState>({ loading: false, page: null, failure: catalogueFailureOf(error) })),
          startWith<TableState>({ loading: true, page: null, failure: null }),
        ),
      ),
    ),
    { initialValue: { loading: true, page: null, failure: null } as TableState },
  );

  /** The rows stay on screen while the next page loads, so the table does not jump. */
  protected readonly shown = linkedSignal<TableState, SpecimenPage | null>({
    source: this.state,
    computation: (state, previous) => state.page ?? previous?.value ?? null,
  });

  protected onFilter(filter: CouponFilter): void {
    this.filter.set(filter);
    this.paging.update((p) => ({ ...p, page: 1 }));
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: Object.fromEntries(Object.entries(filter).filter(([, v]) => v !== null)),
      replaceUrl: true,
    });
  }

  protected onSort(sort: Sort): void {
    const key = SORT_KEYS.includes(sort.active as SpecimenSortKey) ? (sort.active as SpecimenSortKey) : 'specimenCode';
    this.sort.set({ key: sort.direction ? key : 'specimenCode', order: sort.direction === 'desc' ? 'desc' : 'asc' });
    this.paging.update((p) => ({ ...p, page: 1 }));
  }

  protected onPage(event: PageEvent): void {
    this.paging.set({ page: event.pageIndex + 1, pageSize: event.pageSize });
  }

  protected changeStatus(specimen: Specimen): void {
    this.dialog
      .open<StatusDialog, StatusDialogData, Specimen>(StatusDialog, { data: { specimen }, width: '520px' })
      .afterClosed()
      .subscribe((changed) => {
        if (changed) this.reloadCount.update((n) => n + 1);
      });
  }

  private readFilterFromUrl(): CouponFilter {
    const params = this.route.snapshot.queryParamMap;
    const status = params.get('status');
    return {
      ...NO_FILTER,
      material: numberParam(params.get('material')),
      property: params.get('property'),
      condition: params.get('condition'),
      batch: numberParam(params.get('batch')),
      upload: numberParam(params.get('upload')),
      status: status === 'valid' || status === 'excluded' ? status : null,
      q: params.get('q'),
    };
  }
}
