import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { SessionService } from '../../../core/session/session';
import { AllowableDetail, Decision } from '../../../shared/catalogue/allowable-wire';
import { AllowablesApi } from '../../../shared/catalogue/allowables-api';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { QuantityUnitPipe, QuantityValuePipe } from '../../../shared/catalogue/quantity-pipes';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { ProblemList } from '../../../shared/problem-list/problem-list';

export interface DecisionDialogData {
  readonly allowable: AllowableDetail;
  readonly decision: Decision;
}

/**
 * The reviewer's signature: who signs (the signed-in person), when (the
 * server records the exact time), and what the signature means (the API's own
 * statement, sent back unchanged), with the comment the decision needs.
 */
@Component({
  selector: 'app-decision-dialog',
  imports: [
    DatePipe,
    MatButtonModule,
    MatCheckboxModule,
    MatDialogModule,
    MatFormFieldModule,
    MatInputModule,
    ProblemList,
    QuantityUnitPipe,
    QuantityValuePipe,
    ReactiveFormsModule,
  ],
  templateUrl: './decision-dialog.html',
  styleUrl: './decision-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DecisionDialog {
  private readonly api = inject(AllowablesApi);
  private readonly dialogRef = inject<MatDialogRef<DecisionDialog, AllowableDetail>>(MatDialogRef);
  protected readonly data = inject<DecisionDialogData>(MAT_DIALOG_DATA);
  protected readonly signer = inject(SessionService).user();

  protected readonly approving = this.data.decision === 'approve';
  protected readonly meaning = this.data.allowable.signatureMeanings[this.data.decision];
  protected readonly now = signal(new Date());
  protected readonly saving = signal(false);
  protected readonly failure = signal<ApiFailure | null>(null);

  protected readonly form = new FormGroup({
    comment: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(4000)] }),
    sign: new FormControl(false, { nonNullable: true, validators: [Validators.requiredTrue] }),
  });

  constructor() {
    const clock = setInterval(() => this.now.set(new Date()), 1000);
    inject(DestroyRef).onDestroy(() => clearInterval(clock));
  }

  protected confirm(): void {
    const comment = this.form.controls.comment.value.trim();
    if (this.form.invalid || comment === '' || this.saving()) {
      this.form.markAllAsTouched();
      if (comment === '') this.form.controls.comment.setErrors({ required: true });
      return;
    }
    this.saving.set(true);
    this.failure.set(null);
    this.api.decide(this.data.allowable.id, this.data.decision, comment, this.meaning).subscribe({
      next: (decided) => this.dialogRef.close(decided),
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(catalogueFailureOf(error));
      },
    });
  }
}
