import { ChangeDetectionStrategy, Component, DestroyRef, effect, inject, model, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { UnitLabelPipe } from '../../../../../core/units/display-value-pipe';
import { formatForInput } from '../../../../../core/units/number-format';
import { fromDisplay, Quantity, toDisplay } from '../../../../../core/units/unit-conversion';
import { UnitSystem, UnitSystemService } from '../../../../../core/units/unit-system';
import { CRITERIA, CRITERION_LABELS, CriterionName } from '../../../../../shared/laminate/laminate-wire';
import { LoadSettings } from '../load-settings';

const LOAD_FIELDS = [
  { key: 'Nx', label: 'Nx', quantity: 'lineLoad' },
  { key: 'Ny', label: 'Ny', quantity: 'lineLoad' },
  { key: 'Nxy', label: 'Nxy', quantity: 'lineLoad' },
  { key: 'Mx', label: 'Mx', quantity: 'momentPerLength' },
  { key: 'My', label: 'My', quantity: 'momentPerLength' },
  { key: 'Mxy', label: 'Mxy', quantity: 'momentPerLength' },
  { key: 'deltaT', label: 'ΔT', quantity: 'temperatureDifference' },
] as const satisfies readonly { key: string; label: string; quantity: Quantity }[];

type LoadKey = (typeof LOAD_FIELDS)[number]['key'];

const numberControl = () => new FormControl<number | null>(0, { validators: [Validators.required] });

/**
 * Loads, temperature change, factor of safety and criteria, typed in the
 * person's units and kept in internal units: switching SI / US rewrites the
 * fields from the stored values, so nothing drifts by rounding.
 */
@Component({
  selector: 'app-loads-form',
  imports: [MatCheckboxModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule, UnitLabelPipe],
  templateUrl: './loads-form.html',
  styleUrl: './loads-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LoadsForm {
  private readonly units = inject(UnitSystemService);

  readonly settings = model.required<LoadSettings>();

  protected readonly fields = LOAD_FIELDS;
  protected readonly criteria = CRITERIA;
  protected readonly criterionLabels = CRITERION_LABELS;

  protected readonly form = new FormGroup({
    Nx: numberControl(),
    Ny: numberControl(),
    Nxy: numberControl(),
    Mx: numberControl(),
    My: numberControl(),
    Mxy: numberControl(),
    deltaT: numberControl(),
    factorOfSafety: new FormControl<number | null>(1.5, { validators: [Validators.required, Validators.min(0.01)] }),
    criteria: new FormGroup(
      Object.fromEntries(CRITERIA.map((c) => [c, new FormControl(false, { nonNullable: true })])) as Record<
        CriterionName,
        FormControl<boolean>
      >,
    ),
  });

  private lastWritten: LoadSettings | null = null;
  private shownIn: UnitSystem | null = null;

  constructor() {
    effect(() => {
      const settings = this.settings();
      const system = this.units.system();
      untracked(() => {
        if (settings !== this.lastWritten || system !== this.shownIn) this.show(settings, system);
      });
    });
    this.form.valueChanges.pipe(takeUntilDestroyed(inject(DestroyRef))).subscribe(() => this.read());
  }

  private show(settings: LoadSettings, system: UnitSystem): void {
    const display = (value: number, quantity: Quantity) => Number(formatForInput(toDisplay(value, quantity, system)));
    const values: Record<LoadKey, number> = {
      Nx: settings.N[0], Ny: settings.N[1], Nxy: settings.N[2],
      Mx: settings.M[0], My: settings.M[1], Mxy: settings.M[2],
      deltaT: settings.deltaT,
    };
    this.form.patchValue(
      {
        ...Object.fromEntries(LOAD_FIELDS.map((f) => [f.key, display(values[f.key], f.quantity)])),
        factorOfSafety: settings.factorOfSafety,
        criteria: Object.fromEntries(CRITERIA.map((c) => [c, settings.criteria.includes(c)])),
      },
      { emitEvent: false },
    );
    this.shownIn = system;
    this.lastWritten = settings;
  }

  private read(): void {
    if (this.form.invalid) return;
    const system = this.units.system();
    const value = this.form.getRawValue();
    const internal = (key: LoadKey) => {
      const field = LOAD_FIELDS.find((f) => f.key === key)!;
      return fromDisplay(value[key] ?? 0, field.quantity, system);
    };
    const settings: LoadSettings = {
      N: [internal('Nx'), internal('Ny'), internal('Nxy')],
      M: [internal('Mx'), internal('My'), internal('Mxy')],
      deltaT: internal('deltaT'),
      factorOfSafety: value.factorOfSafety ?? 1,
      criteria: CRITERIA.filter((c) => value.criteria[c]),
    };
    this.lastWritten = settings;
    this.settings.set(settings);
  }
}
