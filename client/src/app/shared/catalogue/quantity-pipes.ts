import { inject, Pipe, PipeTransform } from '@angular/core';

import { formatSignificant } from '../../core/units/number-format';
import { toDisplay, unitLabel } from '../../core/units/unit-conversion';
import { UnitSystemService } from '../../core/units/unit-system';
import { displayQuantityOf } from './quantity-display';

/**
 * `{{ value | quantityValue: 'strength' }}`: a catalogue value (strength,
 * modulus, failure-strain, poisson-ratio) in the person's unit system, through
 * the one converter of core/units. Not pure: follows the SI / US switch.
 */
@Pipe({ name: 'quantityValue', pure: false })
export class QuantityValuePipe implements PipeTransform {
  private readonly units = inject(UnitSystemService);

  transform(value: number | null | undefined, quantity: string, digits = 4): string {
    if (value === null || value === undefined) return formatSignificant(value);
    const display = displayQuantityOf(quantity);
    return formatSignificant(display ? toDisplay(value, display, this.units.system()) : value, digits);
  }
}

/** `{{ 'strength' | quantityUnit }}`: the unit a catalogue quantity is shown in ('' for ratios). */
@Pipe({ name: 'quantityUnit', pure: false })
export class QuantityUnitPipe implements PipeTransform {
  private readonly units = inject(UnitSystemService);

  transform(quantity: string): string {
    const display = displayQuantityOf(quantity);
    return display ? unitLabel(display, this.units.system()) : '';
  }
}
