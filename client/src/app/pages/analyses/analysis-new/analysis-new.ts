import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { catchError, of, switchMap } from 'rxjs';

import { SessionService } from '../../../core/session/session';
import { AnalysesApi } from '../../../shared/catalogue/analyses-api';
import { AnalysisQuantity, BasisRequest, METHOD_LABELS, MethodRequest, QUANTITY_LABELS } from '../../../shared/catalogue/analysis-wire';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { DataGroup } from '../../../shared/catalogue/catalogue-wire';
import { MaterialsApi } from '../../../shared/catalogue/materials-api';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { ProblemList } from '../../../shared/problem-list/problem-list';

const METHODS: readonly MethodRequest[] = ['auto', 'weibull', 'normal', 'lognormal', 'nonparametric', 'anova', 'pooled-sd', 'pooled-cv'];

/**
 * Choosing a data group to analyse: a material, a test property, one or
 * several conditions (pooled), the quantity; the method is the decision flow's
 * unless the engineer chooses one and says why.
 */
@Component({
  selector: 'app-analysis-new',
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    ProblemList,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './analysis-new.html',
  styleUrl: './analysis-new.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AnalysisNew {
  private readonly materialsApi = inject(MaterialsApi);
  private readonly analyses = inject(AnalysesApi);
  private readonly router = inject(Router);
  private readonly session = inject(SessionService);
  private readonly query = inject(ActivatedRoute).snapshot.queryParamMap;

  protected readonly mayRun = computed(() => this.session.roles().includes('materials-engineer'));
  protected readonly methodLabels = METHOD_LABELS;
  protected readonly quantityLabels = QUANTITY_LABELS;
  protected readonly methods = METHODS;
  protected readonly quantities: readonly AnalysisQuantity[] = ['strength', 'modulus', 'failure-strain'];
  protected readonly running = signal(false);
  protected readonly failure = signal<ApiFailure | null>(null);

  protected readonly form = new FormGroup({
    material: new FormControl<number | null>(Number(this.query.get('material')) || null, { validators: [Validators.required] }),
    property: new FormControl<string | null>(this.query.get('property'), { validators: [Validators.required] }),
    conditions: new FormControl<readonly string[]>(this.query.getAll('condition'), { nonNullable: true }),
    quantity: new FormControl<AnalysisQuantity>('strength', { nonNullable: true }),
    basis: new FormControl<BasisRequest>('both', { nonNullable: true }),
    method: new FormControl<MethodRequest>('auto', { nonNullable: true }),
    reason: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(2000)] }),
    modifiedCv: new FormControl(false, { nonNullable: true }),
  });
  private readonly value = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });

  protected readonly materials = toSignal(this.materialsApi.materials().pipe(catchError(() => of([]))), { initialValue: [] });
  private readonly materialId = computed(() => this.value().material ?? null);
  protected readonly groups = toSignal(
    toObservable(this.materialId).pipe(
      switchMap((id) => (id ? this.materialsApi.dataGroups(id).pipe(catchError(() => of([] as readonly DataGroup[]))) : of([] as readonly DataGroup[]))),
    ),
    { initialValue: [] as readonly DataGroup[] },
  );
  protected readonly properties = computed(() => [...new Set(this.groups().map((g) => g.property))]);
  /** The conditions with coupons of the chosen property, with their counts. */
  protected readonly conditionGroups = computed(() => this.groups().filter((g) => g.property === this.value().property));
  protected readonly chosenConditions = computed(() => this.value().conditions ?? []);
  protected readonly needsReason = computed(() => (this.value().method ?? 'auto') !== 'auto');

  protected toggleCondition(code: string, on: boolean): void {
    const current = this.form.controls.conditions.value.filter((c) => c !== code);
    this.form.controls.conditions.setValue(on ? [...current, code] : current);
  }

  protected onMaterialChange(): void {
    this.form.patchValue({ property: null, conditions: [] });
  }

  protected onPropertyChange(): void {
    this.form.controls.conditions.setValue([]);
  }

  protected run(): void {
    const v = this.form.getRawValue();
    const reason = v.reason.trim();
    if (this.form.invalid || !v.material || !v.property || v.conditions.length === 0 || (v.method !== 'auto' && !reason) || this.running()) {
      this.form.markAllAsTouched();
      return;
    }
    this.running.set(true);
    this.failure.set(null);
    this.analyses
      .run({
        materialId: v.material,
        property: v.property,
        quantity: v.quantity,
        conditions: v.conditions,
        basis: v.basis,
        method: v.method,
        methodOverrideReason: v.method !== 'auto' ? reason : undefined,
        modifiedCv: v.modifiedCv,
      })
      .subscribe({
        next: (analysis) => void this.router.navigate(['/test-data/analyses', analysis.id]),
        error: (error: unknown) => {
          this.running.set(false);
          this.failure.set(catalogueFailureOf(error));
        },
      });
  }
}
