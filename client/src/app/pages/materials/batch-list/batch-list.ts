import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Observable } from 'rxjs';

import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { Batch, MaterialDetail } from '../../../shared/catalogue/catalogue-wire';
import { MaterialsApi } from '../../../shared/catalogue/materials-api';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { ProblemList } from '../../../shared/problem-list/problem-list';

/**
 * The batches (lots) of a material and the panels made from each. Materials
 * engineers register new ones here; an upload registers those its file names.
 */
@Component({
  selector: 'app-batch-list',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ProblemList, ReactiveFormsModule],
  templateUrl: './batch-list.html',
  styleUrl: './batch-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BatchList {
  private readonly api = inject(MaterialsApi);

  readonly material = input.required<MaterialDetail>();
  readonly mayEdit = input(false);
  /** A batch or panel was registered: the page reads the material again. */
  readonly changed = output<void>();

  protected readonly saving = signal(false);
  protected readonly failure = signal<ApiFailure | null>(null);
  /** The batch whose panel form is open. */
  protected readonly addingPanelTo = signal<number | null>(null);

  protected readonly batchForm = new FormGroup({
    code: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(60)] }),
    manufacturedOn: new FormControl('', { nonNullable: true }),
  });
  protected readonly panelForm = new FormGroup({
    code: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(60)] }),
    curedOn: new FormControl('', { nonNullable: true }),
  });

  protected addBatch(): void {
    if (this.batchForm.invalid || this.saving()) {
      this.batchForm.markAllAsTouched();
      return;
    }
    const { code, manufacturedOn } = this.batchForm.getRawValue();
    this.send(this.api.createBatch(this.material().id, { code: code.trim(), manufacturedOn: manufacturedOn || undefined }), () =>
      this.batchForm.reset(),
    );
  }

  protected openPanelForm(batch: Batch): void {
    this.panelForm.reset();
    this.failure.set(null);
    this.addingPanelTo.set(batch.id);
  }

  protected addPanel(batch: Batch): void {
    if (this.panelForm.invalid || this.saving()) {
      this.panelForm.markAllAsTouched();
      return;
    }
    const { code, curedOn } = this.panelForm.getRawValue();
    this.send(this.api.createPanel(batch.id, { code: code.trim(), curedOn: curedOn || undefined }), () => this.addingPanelTo.set(null));
  }

  private send(request: Observable<unknown>, done: () => void): void {
    this.saving.set(true);
    this.failure.set(null);
    request.subscribe({
      next: () => {
        this.saving.set(false);
        done();
        this.changed.emit();
      },
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(catalogueFailureOf(error));
      },
    });
  }
}
