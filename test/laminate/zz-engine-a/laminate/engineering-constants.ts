/**
 * Apparent engineering constants of a laminate from its compliance abd
 * (Jones chapter 4; Kaw chapter 4; Tsai and Hahn 1980 chapter 4).
 *
 * Both sets are taken from the full 6x6 inverse abd, not from A⁻¹ or D⁻¹
 * alone: for an unsymmetric laminate they are then the constants of the
 * laminate free to bend (membrane) or free to stretch (flexural).
 */

/** In-plane ("membrane") constants: MPa for moduli. */
export interface MembraneConstants {
  Ex: number;
  Ey: number;
  Gxy: number;
  nuxy: number;
  nuyx: number;
  /** shear coupling γxy / εx under Nx alone = a16 / a11 (Jones' η_xy,x) */
  etaxs: number;
  /** γxy / εy under Ny alone = a26 / a22 (Jones' η_xy,y) */
  etays: number;
  /** εx / γxy under Nxy alone = a16 / a66 (Jones' η_x,xy) */
  etasx: number;
  /** εy / γxy under Nxy alone = a26 / a66 (Jones' η_y,xy) */
  etasy: number;
}

/** Bending constants Ex_f = 12 / (h³ d11) and the like, MPa. */
export interface FlexuralConstants {
  Ex: number;
  Ey: number;
  Gxy: number;
  nuxy: number;
}

/** Membrane constants from the 6x6 compliance (row-major) and thickness h (mm). */
export function membraneConstants(abd: ArrayLike<number>, h: number): MembraneConstants {
  const a11 = abd[0], a12 = abd[1], a16 = abd[2], a22 = abd[7], a26 = abd[8], a66 = abd[14];
  return {
    Ex: 1 / (h * a11),
    Ey: 1 / (h * a22),
    Gxy: 1 / (h * a66),
    nuxy: -a12 / a11,
    nuyx: -a12 / a22,
    etaxs: a16 / a11,
    etays: a26 / a22,
    etasx: a16 / a66,
    etasy: a26 / a66,
  };
}

/** Flexural constants from the 6x6 compliance (row-major) and thickness h (mm). */
export function flexuralConstants(abd: ArrayLike<number>, h: number): FlexuralConstants {
  const d11 = abd[21], d12 = abd[22], d22 = abd[28], d66 = abd[35];
  const h3 = h * h * h;
  return { Ex: 12 / (h3 * d11), Ey: 12 / (h3 * d22), Gxy: 12 / (h3 * d66), nuxy: -d12 / d11 };
}
