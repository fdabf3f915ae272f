import { Quantity } from '../../core/units/unit-conversion';

/**
 * The display quantity (core/units) of a catalogue quantity or lamina field
 * kind: strengths read as stresses (MPa / ksi), moduli in GPa / Msi, strains
 * in µε; Poisson's ratio has no unit (null).
 */
export function displayQuantityOf(quantity: string): Quantity | null {
  switch (quantity) {
    case 'strength':
      return 'stress';
    case 'modulus':
      return 'modulus';
    case 'failure-strain':
    case 'strain':
      return 'strain';
    default:
      return null;
  }
}
