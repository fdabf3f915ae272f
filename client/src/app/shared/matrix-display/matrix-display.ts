import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';

import { formatSignificant, withoutRoundOff } from '../../core/units/number-format';
import { Quantity, toDisplay, unitLabel } from '../../core/units/unit-conversion';
import { UnitSystemService } from '../../core/units/unit-system';

/**
 * A stiffness matrix (A, B, D, H) in the person's units, with its name, unit
 * and 1-based subscripts. Each cell carries data-testid="matrix-<name>-<i><j>".
 */
@Component({
  selector: 'app-matrix-display',
  templateUrl: './matrix-display.html',
  styleUrl: './matrix-display.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MatrixDisplay {
  private readonly units = inject(UnitSystemService);

  /** Letter of the matrix, as in A11. */
  readonly name = input.required<string>();
  readonly matrix = input.required<readonly (readonly number[])[]>();
  readonly quantity = input.required<Quantity>();
  /** Subscripts of rows and columns; H is indexed 4, 5. */
  readonly subscripts = input<readonly number[]>([1, 2, 6]);
  readonly digits = input(5);
  /**
   * The size round-off is judged against, in internal units; by default the
   * matrix's largest entry. B needs an outside scale (|A|max · h): a symmetric
   * laminate's B holds nothing but round-off.
   */
  readonly scale = input<number | null>(null);

  protected readonly unit = computed(() => unitLabel(this.quantity(), this.units.system()));

  protected readonly rows = computed(() => {
    const matrix = this.matrix();
    const largest = this.scale() ?? Math.max(0, ...matrix.flat().map(Math.abs));
    const system = this.units.system();
    const subscripts = this.subscripts();
    return matrix.map((row, i) => ({
      key: subscripts[i],
      cells: row.map((value, j) => {
        // A16 of a balanced laminate, B of a symmetric one: zero in exact arithmetic.
        const shown = withoutRoundOff(value, largest);
        return {
          id: `${subscripts[i]}${subscripts[j]}`,
          text: formatSignificant(toDisplay(shown, this.quantity(), system), this.digits()),
          zero: shown === 0,
        };
      }),
    }));
  });
}
