import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatSelectModule } from '@angular/material/select';

import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { MaterialsApi } from '../../../shared/catalogue/materials-api';
import { PlyMapping, StatedMapping } from '../../../shared/catalogue/ply-property-wire';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { ProblemList } from '../../../shared/problem-list/problem-list';

export interface PlyMappingDialogData {
  readonly materialId: number;
  readonly mapping: PlyMapping;
}

type FieldGroup = FormGroup<{ testMethod: FormControl<string>; property: FormControl<string> }>;

/**
 * Stating which test method and property feeds each lamina field of one
 * material. Fields left as they were keep the usual mapping; those changed (or
 * stated before) are sent as stated.
 */
@Component({
  selector: 'app-ply-mapping-dialog',
  imports: [MatButtonModule, MatDialogModule, MatSelectModule, ProblemList, ReactiveFormsModule],
  templateUrl: './ply-mapping-dialog.html',
  styleUrl: './ply-mapping-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlyMappingDialog {
  private readonly api = inject(MaterialsApi);
  private readonly dialogRef = inject<MatDialogRef<PlyMappingDialog, PlyMapping>>(MatDialogRef);
  protected readonly data = inject<PlyMappingDialogData>(MAT_DIALOG_DATA);

  protected readonly testMethods = toSignal(this.api.testMethods$, { initialValue: [] });
  protected readonly saving = signal(false);
  protected readonly failure = signal<ApiFailure | null>(null);

  protected readonly groups: Readonly<Record<string, FieldGroup>> = Object.fromEntries(
    this.data.mapping.fields.map((f) => [
      f.field,
      new FormGroup({
        testMethod: new FormControl(f.testMethod?.code ?? '', { nonNullable: true }),
        property: new FormControl(f.property ?? '', { nonNullable: true }),
      }),
    ]),
  );

  /** Properties each test method yields, for the second select. */
  protected readonly propertiesOf = computed(() => {
    const byMethod = new Map(this.testMethods().map((m) => [m.code, m.properties.map((p) => p.property)]));
    return (method: string) => byMethod.get(method) ?? [];
  });

  protected save(): void {
    const entries: StatedMapping[] = [];
    for (const field of this.data.mapping.fields) {
      const { testMethod, property } = this.groups[field.field].getRawValue();
      const changed = testMethod !== (field.testMethod?.code ?? '') || property !== (field.property ?? '');
      if ((changed || field.source === 'stated') && testMethod && property) entries.push({ field: field.field, testMethod, property });
    }
    this.saving.set(true);
    this.failure.set(null);
    this.api.stateMapping(this.data.materialId, entries).subscribe({
      next: (mapping) => this.dialogRef.close(mapping),
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(catalogueFailureOf(error));
      },
    });
  }
}
