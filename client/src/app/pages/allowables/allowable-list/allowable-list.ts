import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { catchError, debounceTime, map, of, startWith, switchMap } from 'rxjs';

import { Allowable, ALLOWABLE_STATUSES, AllowableFilter, AllowableStatus } from '../../../shared/catalogue/allowable-wire';
import { AllowablesApi } from '../../../shared/catalogue/allowables-api';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { MaterialsApi } from '../../../shared/catalogue/materials-api';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';
import { EngineeringCaution } from '../../../shared/engineering-caution/engineering-caution';
import { StatusChip } from '../status-chip/status-chip';

/**
 * Allowables by material, property, condition and basis; approved ones by
 * default, with their CSV download and the caution beside them.
 */
@Component({
  selector: 'app-allowable-list',
  imports: [
    DatePipe,
    EngineeringCaution,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    MatTableModule,
    QuantityUnitPipe,
    QuantityValuePipe,
    ReactiveFormsModule,
    RouterLink,
    StatusChip,
  ],
  templateUrl: './allowable-list.html',
  styleUrl: './allowable-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AllowableList {
  private readonly api = inject(AllowablesApi);
  private readonly materialsApi = inject(MaterialsApi);

  protected readonly statuses = ALLOWABLE_STATUSES;
  protected readonly columns = ['group', 'basis', 'value', 'revision', 'status', 'method', 'decided'];
  protected readonly materials = toSignal(this.materialsApi.materials().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly properties = toSignal(this.materialsApi.testProperties$.pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly conditions = toSignal(this.materialsApi.conditions$.pipe(catchError(() => of([]))), { initialValue: [] });

  protected readonly form = new FormGroup({
    material: new FormControl<number | null>(null),
    property: new FormControl<string | null>(null),
    condition: new FormControl<string | null>(null),
    basis: new FormControl<'A' | 'B' | null>(null),
    status: new FormControl<AllowableStatus[]>(['approved'], { nonNullable: true }),
  });
  private readonly filter = toSignal(this.form.valueChanges.pipe(debounceTime(150), map(() => this.form.getRawValue())), {
    initialValue: this.form.getRawValue(),
  });

  protected readonly list = toSignal(
    this.form.valueChanges.pipe(
      debounceTime(150),
      startWith(null),
      switchMap(() =>
        this.api.list(this.form.getRawValue() as AllowableFilter).pipe(
          map((reply) => ({ loading: false, items: reply.items, failure: null })),
          catchError((error: unknown) => of({ loading: false, items: [] as readonly Allowable[], failure: catalogueFailureOf(error) })),
          startWith({ loading: true, items: null as readonly Allowable[] | null, failure: null }),
        ),
      ),
    ),
    { initialValue: { loading: true, items: null, failure: null } },
  );

  protected readonly csvUrl = computed(() => this.api.approvedCsvUrl(this.filter() as AllowableFilter));

  constructor() {
    // Older links (the impact banner of layups) name an allowable as ?id=N.
    const id = Number(inject(ActivatedRoute).snapshot.queryParamMap.get('id'));
    if (Number.isInteger(id) && id > 0) void inject(Router).navigate(['/allowables', id], { replaceUrl: true });
  }
}
