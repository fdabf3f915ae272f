import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, input, output, untracked } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { catchError, of, startWith, switchMap } from 'rxjs';

import { UnitLabelPipe } from '../../../core/units/display-value-pipe';
import { formatForInput } from '../../../core/units/number-format';
import { fromDisplay, Quantity, toDisplay } from '../../../core/units/unit-conversion';
import { UnitSystem, UnitSystemService } from '../../../core/units/unit-system';
import { LayupApi } from '../../layups/data/layup-api';
import { LayupSummary } from '../../layups/data/layup-wire';
import {
  ExportRequest,
  FORMAT_LABELS,
  PlateCheckInput,
  SECTION_FORMATS,
  SECTION_UNIT_SYSTEMS,
  SectionFormat,
  SectionUnitSystem,
  StripCheckInput,
  UNIT_SYSTEM_LABELS,
} from '../data/export-wire';

export interface ExportSettings {
  readonly layupId: number;
  readonly request: ExportRequest;
  readonly checks: { readonly strip: StripCheckInput; readonly plate: PlateCheckInput };
}

/** Check inputs (internal units) the page starts with: the server's defaults. */
const STRIP_DEFAULT: StripCheckInput = { widthMm: 25, lengthMm: 250, tipLoadN: 10, elements: 20 };
const PLATE_DEFAULT: PlateCheckInput = { aMm: 500, bMm: 500, pressureMPa: 0.01 };

const CHECK_FIELDS = [
  { key: 'widthMm', label: 'Strip width', quantity: 'length' },
  { key: 'lengthMm', label: 'Strip length', quantity: 'length' },
  { key: 'tipLoadN', label: 'Tip load', quantity: 'force' },
  { key: 'aMm', label: 'Plate a (along x)', quantity: 'length' },
  { key: 'bMm', label: 'Plate b (along y)', quantity: 'length' },
  { key: 'pressureMPa', label: 'Pressure', quantity: 'pressure' },
] as const satisfies readonly { key: string; label: string; quantity: Quantity }[];

type CheckKey = (typeof CHECK_FIELDS)[number]['key'];

const positive = () => new FormControl<number | null>(null, { validators: [Validators.required, Validators.min(1e-9)] });
const id = () => new FormControl(1, { nonNullable: true, validators: [Validators.required, Validators.min(1), Validators.max(99_999_999)] });

/**
 * What to export: the layup revision, the format and unit system, the ids
 * and element set, the reference surface, and the inputs of the two checks.
 */
@Component({
  selector: 'app-export-form',
  imports: [MatCheckboxModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule, UnitLabelPipe],
  templateUrl: './export-form.html',
  styleUrl: './export-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ExportForm {
  private readonly layupsApi = inject(LayupApi);
  private readonly units = inject(UnitSystemService);

  readonly layups = input.required<readonly LayupSummary[]>();
  readonly initialLayupId = input<number | null>(null);
  readonly initialRevisionId = input<number | null>(null);
  readonly settings = output<ExportSettings | null>();

  protected readonly formats = SECTION_FORMATS;
  protected readonly formatLabels = FORMAT_LABELS;
  protected readonly unitSystems = SECTION_UNIT_SYSTEMS;
  protected readonly unitSystemLabels = UNIT_SYSTEM_LABELS;
  protected readonly checkFields = CHECK_FIELDS;

  protected readonly form = new FormGroup({
    layupId: new FormControl<number | null>(null, { validators: [Validators.required] }),
    revisionId: new FormControl<number | null>(null, { validators: [Validators.required] }),
    format: new FormControl<SectionFormat>('calculix', { nonNullable: true }),
    units: new FormControl<SectionUnitSystem>(this.units.system() === 'US' ? 'lbf-in' : 'N-mm-t', { nonNullable: true }),
    propertyId: id(),
    materialId: id(),
    elset: new FormControl('LAMINATE', { nonNullable: true, validators: [Validators.required, Validators.pattern(/^[A-Za-z][A-Za-z0-9_-]*$/)] }),
    referenceOffset: new FormControl(0, { nonNullable: true }),
    freeField: new FormControl(false, { nonNullable: true }),
    checks: new FormGroup({
      widthMm: positive(), lengthMm: positive(), tipLoadN: positive(), aMm: positive(), bMm: positive(), pressureMPa: positive(),
      elements: new FormControl(STRIP_DEFAULT.elements, { nonNullable: true, validators: [Validators.required, Validators.min(1), Validators.max(10_000)] }),
    }),
  });

  protected readonly revisions = toSignal(
    this.form.controls.layupId.valueChanges.pipe(
      startWith(this.form.controls.layupId.value),
      switchMap((layupId) => (layupId ? this.layupsApi.detail(layupId).pipe(catchError(() => of(null))) : of(null))),
    ),
    { initialValue: null },
  );

  private checksInternal: Record<CheckKey, number> = { ...STRIP_DEFAULT, ...PLATE_DEFAULT };
  private checksShownIn: UnitSystem | null = null;

  constructor() {
    effect(() => {
      const layupId = this.initialLayupId();
      const revisionId = this.initialRevisionId();
      untracked(() => {
        if (layupId && this.form.controls.layupId.value !== layupId) this.form.controls.layupId.setValue(layupId);
        if (revisionId) this.form.controls.revisionId.setValue(revisionId);
      });
    });
    // A new layup starts at its latest revision, unless the route named one.
    effect(() => {
      const detail = this.revisions();
      untracked(() => {
        const current = this.form.controls.revisionId.value;
        if (detail && !detail.revisions.some((r) => r.id === current)) this.form.controls.revisionId.setValue(detail.latest.id);
      });
    });
    effect(() => {
      const system = this.units.system();
      untracked(() => this.showChecks(system));
    });
    this.form.valueChanges.pipe(takeUntilDestroyed(inject(DestroyRef))).subscribe(() => this.emit());
  }

  private showChecks(system: UnitSystem): void {
    if (this.checksShownIn === system) return;
    const values = Object.fromEntries(
      CHECK_FIELDS.map((f) => [f.key, Number(formatForInput(toDisplay(this.checksInternal[f.key], f.quantity, system)))]),
    );
    this.form.controls.checks.patchValue(values, { emitEvent: false });
    this.checksShownIn = system;
    this.emit();
  }

  private emit(): void {
    const value = this.form.getRawValue();
    if (this.form.invalid || value.layupId === null || value.revisionId === null) {
      this.settings.emit(null);
      return;
    }
    const system = this.units.system();
    for (const f of CHECK_FIELDS) {
      const typed = value.checks[f.key];
      if (typed !== null) this.checksInternal[f.key] = fromDisplay(typed, f.quantity, system);
    }
    const c = this.checksInternal;
    this.settings.emit({
      layupId: value.layupId,
      request: {
        layupRevisionId: value.revisionId,
        format: value.format,
        units: value.units,
        propertyId: value.propertyId,
        materialId: value.materialId,
        elset: value.elset,
        referenceOffset: value.referenceOffset,
        freeField: value.freeField,
      },
      checks: {
        strip: { widthMm: c.widthMm, lengthMm: c.lengthMm, tipLoadN: c.tipLoadN, elements: value.checks.elements },
        plate: { aMm: c.aMm, bMm: c.bMm, pressureMPa: c.pressureMPa },
      },
    });
  }
}
