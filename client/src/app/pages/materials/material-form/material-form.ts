import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { AbstractControl, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { parseTypedNumber } from '../../../core/units/number-format';
import { fromDisplay, unitLabel } from '../../../core/units/unit-conversion';
import { UnitSystemService } from '../../../core/units/unit-system';
import { ApiFailure } from '../../../shared/laminate/api-problem';
import { catalogueFailureOf } from '../../../shared/catalogue/api-failure';
import { Material, MATERIAL_FORMS, MaterialForm as Form, NewMaterial } from '../../../shared/catalogue/catalogue-wire';
import { MaterialsApi } from '../../../shared/catalogue/materials-api';
import { ProblemList } from '../../../shared/problem-list/problem-list';

/** A typed number ("0,29" reads 0.29), or empty when the field is optional. */
function typedNumber(control: AbstractControl<string>): ValidationErrors | null {
  const text = control.value.trim();
  if (text === '') return null;
  const value = parseTypedNumber(text);
  return value === null || value <= 0 ? { number: true } : null;
}

/** Registering a material system (materials engineers); the API checks the code is new. */
@Component({
  selector: 'app-material-form',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, ProblemList, ReactiveFormsModule],
  templateUrl: './material-form.html',
  styleUrl: './material-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialForm {
  private readonly api = inject(MaterialsApi);
  private readonly units = inject(UnitSystemService);
  private readonly dialogRef = inject<MatDialogRef<MaterialForm, Material>>(MatDialogRef);

  protected readonly forms = MATERIAL_FORMS;
  protected readonly lengthUnit = computed(() => unitLabel('length', this.units.system()));
  protected readonly densityUnit = computed(() => unitLabel('density', this.units.system()));
  protected readonly saving = signal(false);
  protected readonly failure = signal<ApiFailure | null>(null);

  protected readonly form = new FormGroup({
    code: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(40)] }),
    name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(200)] }),
    form: new FormControl<Form>('unidirectional-tape', { nonNullable: true }),
    fibre: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    resin: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    plyThickness: new FormControl('', { nonNullable: true, validators: [typedNumber] }),
    fibreArealWeightGm2: new FormControl('', { nonNullable: true, validators: [typedNumber] }),
    resinContentPct: new FormControl('', { nonNullable: true, validators: [typedNumber] }),
    density: new FormControl('', { nonNullable: true, validators: [typedNumber] }),
    specificationRef: new FormControl('', { nonNullable: true }),
    notes: new FormControl('', { nonNullable: true }),
  });

  private readonly chosenForm = toSignal(this.form.controls.form.valueChanges, { initialValue: this.form.controls.form.value });
  /** A core has no cured ply thickness to normalise to; every ply material needs one. */
  protected readonly needsPlyThickness = computed(() => this.chosenForm() !== 'core');

  protected submit(): void {
    const thickness = this.form.controls.plyThickness.value.trim();
    if (this.needsPlyThickness() && thickness === '') this.form.controls.plyThickness.setErrors({ required: true });
    if (this.form.invalid || this.saving()) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    this.failure.set(null);
    this.api.createMaterial(this.request()).subscribe({
      next: (material) => this.dialogRef.close(material),
      error: (error: unknown) => {
        this.failure.set(catalogueFailureOf(error));
        this.saving.set(false);
      },
    });
  }

  private request(): NewMaterial {
    const v = this.form.getRawValue();
    const system = this.units.system();
    const optional = (text: string, convert: (n: number) => number = (n) => n) => {
      const n = parseTypedNumber(text);
      return n === null ? undefined : convert(n);
    };
    return {
      code: v.code.trim(),
      name: v.name.trim(),
      form: v.form,
      fibre: v.fibre.trim(),
      resin: v.resin.trim(),
      nominalCuredPlyThicknessMm: optional(v.plyThickness, (n) => fromDisplay(n, 'length', system)),
      fibreArealWeightGm2: optional(v.fibreArealWeightGm2),
      resinContentPct: optional(v.resinContentPct),
      densityKgM3: optional(v.density, (n) => fromDisplay(n, 'density', system)),
      specificationRef: v.specificationRef.trim() || undefined,
      notes: v.notes.trim() || undefined,
    };
  }
}
