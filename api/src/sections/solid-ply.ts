/**
 * A ply as a three-dimensional orthotropic solid, for solvers that expand a
 * composite shell into bricks (CalculiX turns each layer of an S8R into a
 * C3D20R, see CONTEXT.md) and so need E3, nu13 and nu23, which a ply material
 * of Plyledger does not carry.
 *
 * Assumptions (common practice for unidirectional tape, transverse isotropy
 * about the fibre): E3 = E2, nu13 = nu12, nu23 = E2 / (2 G23) - 1 when that
 * lies in [0, 0.49], else nu12. When these make the compliance not positive
 * definite (fabrics and cores with a large nu12), nu13 and nu23 are halved
 * until it is. None of them changes the shell's membrane and bending
 * stiffness while the through-thickness stress is zero, because the reduced
 * stiffness Q of plane stress is built from E1, E2, nu12 and G12 alone
 * (Jones 1999, section 2.5, section number from memory).
 */
import { InputError } from '../shared/input-error.ts';
import type { PreparedMaterial } from './prepare.ts';

export interface SolidPlyConstants {
  E1: number; E2: number; E3: number;
  nu12: number; nu13: number; nu23: number;
  G12: number; G13: number; G23: number;
}

/** Positive definiteness of the orthotropic compliance (Jones 1999, section 2.4, restrictions on engineering constants; section number from memory). */
export function isPositiveDefinite(c: SolidPlyConstants): boolean {
  const nu21 = (c.nu12 * c.E2) / c.E1;
  const nu31 = (c.nu13 * c.E3) / c.E1;
  const nu32 = (c.nu23 * c.E3) / c.E2;
  const delta = 1 - c.nu12 * nu21 - c.nu23 * nu32 - c.nu13 * nu31 - 2 * nu21 * nu32 * c.nu13;
  return [c.E1, c.E2, c.E3, c.G12, c.G13, c.G23].every((v) => v > 0) && 1 - c.nu12 * nu21 > 0 && 1 - c.nu23 * nu32 > 0 && 1 - c.nu13 * nu31 > 0 && delta > 0;
}

export function solidPlyConstants(material: PreparedMaterial): SolidPlyConstants {
  const v = material.values;
  const fromG23 = v.E2 / (2 * material.G23) - 1;
  const nu23 = fromG23 >= 0 && fromG23 <= 0.49 ? fromG23 : v.nu12;
  const c: SolidPlyConstants = {
    E1: v.E1, E2: v.E2, E3: v.E2,
    nu12: v.nu12, nu13: v.nu12, nu23,
    G12: v.G12, G13: material.G13, G23: material.G23,
  };
  for (let i = 0; i < 40 && !isPositiveDefinite(c); i++) {
    c.nu13 /= 2;
    c.nu23 /= 2;
  }
  if (!isPositiveDefinite(c)) {
    throw new InputError({
      field: `materials.${material.label}`,
      message: 'gives no positive-definite solid compliance (E1, E2, nu12, G12, G13, G23)',
      fix: 'check the moduli and Poisson ratio of this material',
    });
  }
  return c;
}
