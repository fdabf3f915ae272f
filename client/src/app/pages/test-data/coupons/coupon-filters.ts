import { ChangeDetectionStrategy, Component, DestroyRef, inject, input, OnInit, output, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { catchError, debounceTime, map, of, startWith, switchMap } from 'rxjs';

import { SpecimenStatus } from '../../../shared/catalogue/coupon-wire';
import { MaterialsApi } from '../../../shared/catalogue/materials-api';

/** What the coupon table is filtered by (GET /specimens query). */
export interface CouponFilter {
  readonly material: number | null;
  readonly property: string | null;
  readonly condition: string | null;
  readonly batch: number | null;
  readonly status: SpecimenStatus | null;
  readonly q: string | null;
  readonly upload: number | null;
}

export const NO_FILTER: CouponFilter = { material: null, property: null, condition: null, batch: null, status: null, q: null, upload: null };

/** The filters above the coupon table; typing in the specimen id waits for a pause. */
@Component({
  selector: 'app-coupon-filters',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './coupon-filters.html',
  styleUrl: './coupon-filters.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CouponFilters implements OnInit {
  private readonly api = inject(MaterialsApi);
  private readonly destroyRef = inject(DestroyRef);

  readonly initial = input<CouponFilter>(NO_FILTER);
  readonly filterChange = output<CouponFilter>();

  protected readonly form = new FormGroup({
    material: new FormControl<number | null>(null),
    property: new FormControl<string | null>(null),
    condition: new FormControl<string | null>(null),
    batch: new FormControl<number | null>(null),
    status: new FormControl<SpecimenStatus | null>(null),
    q: new FormControl<string>('', { nonNullable: true }),
  });
  /** The upload the table was opened for (from the upload's result), until cleared. */
  protected readonly upload = signal<number | null>(null);

  protected readonly materials = toSignal(this.api.materials().pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly properties = toSignal(this.api.testProperties$.pipe(catchError(() => of([]))), { initialValue: [] });
  protected readonly conditions = toSignal(this.api.conditions$.pipe(catchError(() => of([]))), { initialValue: [] });

  private readonly chosenMaterial = toSignal(this.form.controls.material.valueChanges, { initialValue: null });
  /** The batches of the chosen material (a batch code means nothing without its material). */
  protected readonly batches = toSignal(
    toObservable(this.chosenMaterial).pipe(
      switchMap((id) => (id ? this.api.material(id).pipe(map((m) => m.batches), catchError(() => of([]))) : of([]))),
    ),
    { initialValue: [] },
  );

  ngOnInit(): void {
    const start = this.initial();
    this.upload.set(start.upload);
    this.form.setValue({
      material: start.material,
      property: start.property,
      condition: start.condition,
      batch: start.batch,
      status: start.status,
      q: start.q ?? '',
    });
    this.form.controls.material.valueChanges.pipe(takeUntilDestroyed(this.destroyRef)).subscribe(() => this.form.controls.batch.setValue(null, { emitEvent: false }));
    this.form.valueChanges
      .pipe(debounceTime(300), startWith(this.form.getRawValue()), takeUntilDestroyed(this.destroyRef))
      .subscribe(() => this.emit());
  }

  protected clearUpload(): void {
    this.upload.set(null);
    this.emit();
  }

  protected clearAll(): void {
    this.upload.set(null);
    this.form.reset({ material: null, property: null, condition: null, batch: null, status: null, q: '' });
  }

  private emit(): void {
    const v = this.form.getRawValue();
    this.filterChange.emit({ ...v, q: v.q.trim() || null, upload: this.upload() });
  }
}
