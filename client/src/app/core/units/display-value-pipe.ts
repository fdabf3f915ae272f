import { inject, Pipe, PipeTransform } from '@angular/core';

import { formatSignificant } from './number-format';
import { Quantity, toDisplay, unitLabel } from './unit-conversion';
import { UnitSystemService } from './unit-system';

/**
 * `{{ a11 | displayValue: 'stiffnessA' }}`: an internal value converted to the
 * person's unit system and written with `digits` significant digits. Not pure:
 * it reads the unit-system signal, so a switch of SI / US redraws the value.
 */
@Pipe({ name: 'displayValue', pure: false })
export class DisplayValuePipe implements PipeTransform {
  private readonly units = inject(UnitSystemService);

  transform(value: number | null | undefined, quantity: Quantity, digits = 4): string {
    if (value === null || value === undefined) return formatSignificant(value);
    return formatSignificant(toDisplay(value, quantity, this.units.system()), digits);
  }
}

/** `{{ 'stress' | unitLabel }}`: the unit a quantity is shown in (MPa or ksi). */
@Pipe({ name: 'unitLabel', pure: false })
export class UnitLabelPipe implements PipeTransform {
  private readonly units = inject(UnitSystemService);

  transform(quantity: Quantity): string {
    return unitLabel(quantity, this.units.system());
  }
}
