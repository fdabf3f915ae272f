import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';

import { AllowableDetail } from '../../../shared/catalogue/allowable-wire';
import { AllowablesApi } from '../../../shared/catalogue/allowables-api';
import { AnalysisDetail } from '../../../shared/catalogue/analysis-wire';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { ProblemList } from '../../../shared/problem-list/problem-list';
import { conditionCodes } from '../analysis-view/analysis-group';

/**
 * Proposing an allowable from an analysis: one basis, one condition (of a
 * pooled analysis), a comment for the reviewer. The proposal goes to the
 * quality reviewers at once, or is kept as a draft.
 */
@Component({
  selector: 'app-propose-dialog',
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    MatDialogModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    ProblemList,
    QuantityUnitPipe,
    QuantityValuePipe,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './propose-dialog.html',
  styleUrl: './propose-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProposeDialog {
  private readonly api = inject(AllowablesApi);
  private readonly dialogRef = inject<MatDialogRef<ProposeDialog, AllowableDetail>>(MatDialogRef);
  protected readonly analysis = inject<AnalysisDetail>(MAT_DIALOG_DATA);

  protected readonly conditions = conditionCodes(this.analysis);
  protected readonly pooled = this.conditions.length > 1;
  protected readonly saving = signal(false);
  protected readonly failure = signal<ApiFailure | null>(null);
  /** 409: an open allowable exists for the same key. */
  protected readonly openOne = signal<number | null>(null);

  protected readonly form = new FormGroup({
    basis: new FormControl<'A' | 'B'>('B', { nonNullable: true }),
    condition: new FormControl(this.conditions[0], { nonNullable: true }),
    comment: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(4000)] }),
  });
  private readonly choice = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });

  /** The value that would be proposed, from the analysis (per condition when pooled). */
  protected readonly value = computed(() => {
    const { basis, condition } = { ...this.form.getRawValue(), ...this.choice() };
    const source = this.pooled ? this.analysis.result.byCondition?.[condition ?? ''] : this.analysis.result;
    if (!source) return { value: null, provisional: false };
    return basis === 'A'
      ? { value: source.aBasis, provisional: source.provisionalDetail.aBasis }
      : { value: source.bBasis, provisional: source.provisionalDetail.bBasis };
  });

  protected submit(sendToReview: boolean): void {
    if (this.form.invalid || this.saving() || this.value().value === null) return;
    const { basis, condition, comment } = this.form.getRawValue();
    this.saving.set(true);
    this.failure.set(null);
    this.openOne.set(null);
    this.api
      .propose({ analysisId: this.analysis.id, basis, condition: this.pooled ? condition : undefined, comment: comment.trim() || undefined, submit: sendToReview })
      .subscribe({
        next: (allowable) => this.dialogRef.close(allowable),
        error: (error: unknown) => {
          this.saving.set(false);
          const failure = catalogueFailureOf(error);
          this.failure.set(failure);
          const details = (error as { error?: { error?: { details?: { allowableId?: number } } } }).error?.error?.details;
          if (failure.status === 409 && details?.allowableId) this.openOne.set(details.allowableId);
        },
      });
  }

  protected close(): void {
    this.dialogRef.close();
  }
}
