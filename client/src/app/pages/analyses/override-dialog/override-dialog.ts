import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { AnalysesApi } from '../../../shared/catalogue/analyses-api';
import { AnalysisDetail, BasisMethod, METHOD_LABELS } from '../../../shared/catalogue/analysis-wire';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { ProblemList } from '../../../shared/problem-list/problem-list';

const SINGLE_GROUP: readonly BasisMethod[] = ['normal', 'lognormal', 'weibull', 'nonparametric', 'anova'];
const POOLED: readonly BasisMethod[] = ['pooled-sd', 'pooled-cv'];

/**
 * Choosing the method instead of the decision flow: a new analysis on the same
 * input, with the reason recorded; the diagnostics that argue against the
 * choice stay on the record.
 */
@Component({
  selector: 'app-override-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, ProblemList, ReactiveFormsModule],
  templateUrl: './override-dialog.html',
  styles: '.wide { width: 100%; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OverrideDialog {
  private readonly api = inject(AnalysesApi);
  private readonly dialogRef = inject<MatDialogRef<OverrideDialog, AnalysisDetail>>(MatDialogRef);
  protected readonly analysis = inject<AnalysisDetail>(MAT_DIALOG_DATA);

  protected readonly labels = METHOD_LABELS;
  protected readonly methods = computed(() => (this.analysis.conditions.length > 1 ? [...POOLED, ...SINGLE_GROUP] : SINGLE_GROUP));
  protected readonly saving = signal(false);
  protected readonly failure = signal<ApiFailure | null>(null);

  protected readonly form = new FormGroup({
    method: new FormControl<BasisMethod | null>(null, { validators: [Validators.required] }),
    reason: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(2000)] }),
  });

  protected submit(): void {
    const { method, reason } = this.form.getRawValue();
    if (this.form.invalid || !method || reason.trim() === '' || this.saving()) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    this.failure.set(null);
    this.api.override(this.analysis.id, method, reason.trim()).subscribe({
      next: (created) => this.dialogRef.close(created),
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(catalogueFailureOf(error));
      },
    });
  }
}
