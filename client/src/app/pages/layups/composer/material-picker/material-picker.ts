import { ChangeDetectionStrategy, Component, computed, inject, input, model, output } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { catchError, debounceTime, map, of, startWith, switchMap } from 'rxjs';

import { formatForInput, parseTypedNumber } from '../../../../core/units/number-format';
import { fromDisplay, toDisplay, unitLabel } from '../../../../core/units/unit-conversion';
import { UnitSystemService } from '../../../../core/units/unit-system';
import { Condition, Material } from '../../../../shared/catalogue/catalogue-wire';
import { MaterialsApi } from '../../../../shared/catalogue/materials-api';
import { Approval, Basis, LaminaChoice } from '../../data/layup-wire';
import { LaminaBadge } from '../lamina-badge/lamina-badge';
import { MaterialChoice } from '../ply-list';
import { approvalOfSet, materialMatches } from './material-search';

type Source = Basis | 'typical';

/**
 * Chooses the material, condition and basis that new plies and a typed
 * laminate code get, and says before it is used whether approved allowables
 * exist for that choice (GET /materials/{id}/ply-properties, through the
 * catalogue's MaterialsApi).
 */
@Component({
  selector: 'app-material-picker',
  imports: [
    LaminaBadge,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    ReactiveFormsModule,
  ],
  templateUrl: './material-picker.html',
  styleUrl: './material-picker.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialPicker {
  private readonly catalogue = inject(MaterialsApi);
  private readonly units = inject(UnitSystemService);

  readonly materials = input.required<readonly Material[]>();
  readonly conditions = input.required<readonly Condition[]>();
  readonly choice = model<MaterialChoice | null>(null);
  readonly readonly = input(false);
  readonly applyToAll = output<MaterialChoice>();

  protected readonly search = new FormControl('', { nonNullable: true });
  private readonly searchText = toSignal(this.search.valueChanges.pipe(debounceTime(120)), { initialValue: '' });

  protected readonly found = computed(() => this.materials().filter((m) => materialMatches(m, this.searchText())));
  protected readonly chosenMaterial = computed(() => this.materials().find((m) => m.id === this.choice()?.materialId) ?? null);
  protected readonly source = computed<Source>(() => {
    const lamina = this.choice()?.lamina;
    return !lamina || lamina.source === 'typical' ? 'typical' : lamina.basis;
  });
  protected readonly lengthUnit = computed(() => unitLabel('length', this.units.system()));
  protected readonly thickness = computed(() => {
    const mm = this.choice()?.thicknessMm;
    return formatForInput(mm === null || mm === undefined ? null : toDisplay(mm, 'length', this.units.system()));
  });
  protected readonly nominalThickness = computed(() => {
    const mm = this.chosenMaterial()?.nominalCuredPlyThicknessMm;
    return formatForInput(mm === null || mm === undefined ? null : toDisplay(mm, 'length', this.units.system()));
  });

  private readonly statusKey = computed(() => {
    const choice = this.choice();
    const known = this.conditions().some((c) => c.id === choice?.lamina.conditionId);
    return choice && known ? { materialId: choice.materialId, lamina: choice.lamina } : null;
  }, { equal: (a, b) => JSON.stringify(a) === JSON.stringify(b) });

  /** Whether approved allowables exist for the chosen material, condition and basis. */
  protected readonly status = toSignal(
    toObservable(this.statusKey).pipe(
      switchMap((key) => {
        if (!key) return of(null);
        const basis = key.lamina.source === 'typical' ? 'mean' : key.lamina.basis;
        return this.catalogue.plyPropertySets(key.materialId, basis).pipe(
          map((sets) => sets.find((s) => s.condition.id === key.lamina.conditionId) ?? null),
          map((set) => ({ loading: false, approval: approvalOfSet(key.lamina, set), set, failed: false })),
          catchError(() => of({ loading: false, approval: null as Approval | null, set: null, failed: true })),
          startWith({ loading: true, approval: null as Approval | null, set: null, failed: false }),
        );
      }),
    ),
    { initialValue: null },
  );

  protected pickMaterial(material: Material): void {
    const current = this.choice();
    const lamina: LaminaChoice = current?.lamina ?? this.defaultLamina();
    this.choice.set({ materialId: material.id, lamina, thicknessMm: null });
  }

  protected setCondition(conditionId: number): void {
    this.updateLamina(this.source(), conditionId);
  }

  protected setSource(source: Source): void {
    const conditionId = this.choice()?.lamina.conditionId;
    if (conditionId !== undefined) this.updateLamina(source, conditionId);
  }

  protected setThickness(text: string): void {
    const current = this.choice();
    if (!current) return;
    const typed = parseTypedNumber(text);
    const thicknessMm = text.trim() === '' || typed === null || typed <= 0 ? null : fromDisplay(typed, 'length', this.units.system());
    this.choice.set({ ...current, thicknessMm });
  }

  protected apply(): void {
    const current = this.choice();
    if (current) this.applyToAll.emit(current);
  }

  private updateLamina(source: Source, conditionId: number): void {
    const current = this.choice();
    if (!current) return;
    const lamina: LaminaChoice =
      source === 'typical' ? { source: 'typical', conditionId } : { source: 'ply-property-set', conditionId, basis: source };
    this.choice.set({ ...current, lamina });
  }

  /** Room-temperature dry, B-basis, when the catalogue has that condition: the usual design starting point. */
  private defaultLamina(): LaminaChoice {
    const conditions = this.conditions();
    const condition = conditions.find((c) => c.code === 'RTD') ?? conditions[0];
    return { source: 'ply-property-set', conditionId: condition?.id ?? 1, basis: 'B' };
  }
}
