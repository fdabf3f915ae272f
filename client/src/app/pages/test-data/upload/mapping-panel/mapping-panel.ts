import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';

import { ColumnMapping, unitStatedBy } from '../column-mapping';
import { columnUnitLabel, ForceUnit, LengthUnit, StressUnit, TEMPLATE_FIELDS, TemplateField } from '../template-fields';

export interface UnitChoice {
  readonly stressUnit: StressUnit;
  readonly lengthUnit: LengthUnit;
  readonly forceUnit: ForceUnit;
}

/**
 * The column mapping: for each template field, the header of the file that
 * feeds it (found by the template's names first), and the unit the column is
 * read in under the chosen units.
 */
@Component({
  selector: 'app-mapping-panel',
  imports: [MatIconModule, MatSelectModule],
  templateUrl: './mapping-panel.html',
  styleUrl: './mapping-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MappingPanel {
  readonly headers = input.required<readonly string[]>();
  readonly mapping = input.required<ColumnMapping>();
  readonly units = input.required<UnitChoice>();
  readonly mappingChange = output<ColumnMapping>();

  protected readonly rows = computed(() =>
    TEMPLATE_FIELDS.map((field) => {
      const header = this.mapping()[field.field];
      const unit = columnUnitLabel(field, this.units());
      const stated = header ? unitStatedBy(field, header) : null;
      const chosen = field.dimension === 'length' ? this.units().lengthUnit : field.dimension === 'force' ? this.units().forceUnit : this.units().stressUnit;
      return { field, header, unit, contradicts: stated !== null && stated !== chosen };
    }),
  );

  protected choose(field: TemplateField, header: string | null): void {
    this.mappingChange.emit({ ...this.mapping(), [field.field]: header });
  }
}
