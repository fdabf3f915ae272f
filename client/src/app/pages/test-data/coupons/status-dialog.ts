import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { Specimen } from '../../../shared/catalogue/coupon-wire';
import { CouponsApi } from '../../../shared/catalogue/coupons-api';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { ProblemList } from '../../../shared/problem-list/problem-list';

export interface StatusDialogData {
  readonly specimen: Specimen;
}

/**
 * Excluding a coupon from analyses, or restoring it, always with a reason:
 * values are never dropped silently (ENGINEERING.md 2.3, after CMH-17-1G
 * Vol. 1 ch. 8); the change is audited.
 */
@Component({
  selector: 'app-status-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, ProblemList, ReactiveFormsModule],
  templateUrl: './status-dialog.html',
  styles: '.reason { width: 100%; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StatusDialog {
  private readonly api = inject(CouponsApi);
  private readonly dialogRef = inject<MatDialogRef<StatusDialog, Specimen>>(MatDialogRef);
  protected readonly specimen = inject<StatusDialogData>(MAT_DIALOG_DATA).specimen;
  protected readonly excluding = this.specimen.status === 'valid';

  protected readonly reason = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(2000)] });
  protected readonly saving = signal(false);
  protected readonly failure = signal<ApiFailure | null>(null);

  protected confirm(): void {
    if (this.reason.invalid || this.reason.value.trim() === '' || this.saving()) {
      this.reason.markAsTouched();
      this.reason.setErrors({ required: true });
      return;
    }
    this.saving.set(true);
    this.failure.set(null);
    this.api.changeStatus(this.specimen.id, this.excluding ? 'excluded' : 'valid', this.reason.value.trim()).subscribe({
      next: (changed) => this.dialogRef.close(changed),
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(catalogueFailureOf(error));
      },
    });
  }
}
