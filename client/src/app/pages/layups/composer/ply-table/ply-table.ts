import { CdkDrag, CdkDragDrop, CdkDragHandle, CdkDropList } from '@angular/cdk/drag-drop';
import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';

import { formatForInput, parseTypedNumber } from '../../../../core/units/number-format';
import { fromDisplay, toDisplay, unitLabel } from '../../../../core/units/unit-conversion';
import { UnitSystemService } from '../../../../core/units/unit-system';
import { angleSwatch } from '../../../../shared/laminate/ply-angle-palette';
import { Material } from '../../../../shared/catalogue/catalogue-wire';
import { ComposerPly, duplicatePly, laminaFromKey, laminaKey, movePly, removePly, updatePly } from '../ply-list';
import { LaminaOption } from './lamina-options';

/**
 * The ply table: one row per ply, first ply (bottom, z = -h/2) first. Rows move
 * by drag and drop or by the up/down buttons (keyboard); each edit emits the
 * whole new list, which the composer keeps and sends to be computed.
 */
@Component({
  selector: 'app-ply-table',
  imports: [CdkDrag, CdkDragHandle, CdkDropList, MatButtonModule, MatIconModule, MatTooltipModule],
  templateUrl: './ply-table.html',
  styleUrl: './ply-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlyTable {
  private readonly units = inject(UnitSystemService);

  readonly plies = input.required<readonly ComposerPly[]>();
  readonly materials = input.required<readonly Material[]>();
  readonly laminaOptions = input.required<readonly LaminaOption[]>();
  /** Messages of the API by ply index (from fields such as plies[3].thetaDeg). */
  readonly problems = input<ReadonlyMap<number, string>>(new Map());
  readonly readonly = input(false);
  readonly edited = output<ComposerPly[]>();

  protected readonly lengthUnit = computed(() => unitLabel('length', this.units.system()));

  protected readonly rows = computed(() => {
    const system = this.units.system();
    const byId = new Map(this.materials().map((m) => [m.id, m]));
    return this.plies().map((ply, index) => {
      const nominal = byId.get(ply.materialId)?.nominalCuredPlyThicknessMm ?? null;
      return {
        ply,
        index,
        swatch: angleSwatch(ply.thetaDeg),
        laminaKey: laminaKey(ply.lamina),
        thickness: formatForInput(ply.thicknessMm === null ? null : toDisplay(ply.thicknessMm, 'length', system)),
        nominal: formatForInput(nominal === null ? null : toDisplay(nominal, 'length', system)),
        problem: this.problems().get(index) ?? null,
      };
    });
  });

  protected drop(event: CdkDragDrop<unknown>): void {
    if (event.previousIndex !== event.currentIndex) {
      this.edited.emit(movePly(this.plies(), event.previousIndex, event.currentIndex));
    }
  }

  protected move(index: number, by: number): void {
    this.edited.emit(movePly(this.plies(), index, index + by));
  }

  protected duplicate(index: number): void {
    this.edited.emit(duplicatePly(this.plies(), index));
  }

  protected remove(index: number): void {
    this.edited.emit(removePly(this.plies(), index));
  }

  protected setAngle(index: number, text: string): void {
    const thetaDeg = parseTypedNumber(text);
    if (thetaDeg !== null && thetaDeg !== this.plies()[index]?.thetaDeg) {
      this.edited.emit(updatePly(this.plies(), index, { thetaDeg }));
    }
  }

  protected setThickness(index: number, text: string): void {
    const typed = parseTypedNumber(text);
    if (text.trim() === '') {
      this.edited.emit(updatePly(this.plies(), index, { thicknessMm: null }));
    } else if (typed !== null && typed > 0) {
      this.edited.emit(updatePly(this.plies(), index, { thicknessMm: fromDisplay(typed, 'length', this.units.system()) }));
    }
  }

  protected setMaterial(index: number, value: string): void {
    this.edited.emit(updatePly(this.plies(), index, { materialId: Number(value) }));
  }

  protected setLamina(index: number, key: string): void {
    const lamina = laminaFromKey(key);
    if (lamina) this.edited.emit(updatePly(this.plies(), index, { lamina }));
  }
}
