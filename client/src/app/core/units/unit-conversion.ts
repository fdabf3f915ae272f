/**
 * Display units: the one converter between the API's internal units
 * (ENGINEERING.md section 1: mm, N, MPa, N/mm, N·mm, °C, kg/m³) and what a
 * person reads and types in SI or US customary units. Pure numbers in and out.
 *
 * Factors from NIST Special Publication 811 (2008 edition), Appendix B.8/B.9,
 * built from the exact definitions given there rather than the rounded
 * products: 1 in = 0.0254 m (exact), 1 lb (avoirdupois) = 0.453 592 37 kg
 * (exact), standard gravity 9.806 65 m/s² (exact), so 1 lbf = 4.448 221 615 260 5 N,
 * 1 psi = 6.894 757 293 168 kPa; 1 °F interval = 5/9 K, t/°F = 1.8 t/°C + 32.
 */
/** SI (N, mm, MPa) or US customary (lbf, in, ksi/psi). */
export type UnitSystem = 'SI' | 'US';

/** Newtons in one pound-force (NIST SP 811 B.8: lbf = lb × gₙ, both exact). */
export const NEWTONS_PER_POUND_FORCE = 0.45359237 * 9.80665;
/** Millimetres in one inch (NIST SP 811 B.8, exact). */
export const MILLIMETRES_PER_INCH = 25.4;
/** Kilograms in one pound avoirdupois (NIST SP 811 B.8, exact). */
export const KILOGRAMS_PER_POUND = 0.45359237;
/** Megapascals in one psi: lbf / in², from the two exact factors above. */
export const MEGAPASCALS_PER_PSI = NEWTONS_PER_POUND_FORCE / MILLIMETRES_PER_INCH ** 2;
/** Kelvin (or °C) in one degree Fahrenheit interval (NIST SP 811 B.9, exact). */
export const KELVIN_PER_FAHRENHEIT_DEGREE = 5 / 9;

/**
 * What a number means physically. `temperature` is a thermometer reading
 * (°C ⇄ °F with the offset); `temperatureDifference` is an interval such as
 * the ΔT of a load case (K ⇄ °F, no offset).
 */
export type Quantity =
  | 'length'
  | 'stress'
  | 'pressure'
  | 'modulus'
  | 'force'
  | 'lineLoad'
  | 'momentPerLength'
  | 'stiffnessA'
  | 'stiffnessB'
  | 'stiffnessD'
  | 'stiffnessH'
  | 'curvature'
  | 'strain'
  | 'temperature'
  | 'temperatureDifference'
  | 'expansion'
  | 'density'
  | 'arealMass';

/** display = internal × factor + offset */
interface DisplayUnit {
  readonly label: string;
  readonly factor: number;
  readonly offset?: number;
}

const lbfPerNewton = 1 / NEWTONS_PER_POUND_FORCE;
const inchPerMm = 1 / MILLIMETRES_PER_INCH;

/**
 * Internal unit of each quantity (what the API sends) and its SI and US
 * display units. Stresses and strengths read in ksi and moduli in Msi, as
 * composite data sheets in US units are usually written (common practice);
 * pressures (plate checks) in psi.
 */
const UNITS: Readonly<Record<Quantity, { internal: string; SI: DisplayUnit; US: DisplayUnit }>> = {
  length: { internal: 'mm', SI: { label: 'mm', factor: 1 }, US: { label: 'in', factor: inchPerMm } },
  stress: { internal: 'MPa', SI: { label: 'MPa', factor: 1 }, US: { label: 'ksi', factor: 1 / MEGAPASCALS_PER_PSI / 1000 } },
  pressure: { internal: 'MPa', SI: { label: 'kPa', factor: 1000 }, US: { label: 'psi', factor: 1 / MEGAPASCALS_PER_PSI } },
  modulus: { internal: 'MPa', SI: { label: 'GPa', factor: 1e-3 }, US: { label: 'Msi', factor: 1 / MEGAPASCALS_PER_PSI / 1e6 } },
  force: { internal: 'N', SI: { label: 'N', factor: 1 }, US: { label: 'lbf', factor: lbfPerNewton } },
  lineLoad: { internal: 'N/mm', SI: { label: 'N/mm', factor: 1 }, US: { label: 'lbf/in', factor: lbfPerNewton * MILLIMETRES_PER_INCH } },
  momentPerLength: { internal: 'N·mm/mm', SI: { label: 'N·mm/mm', factor: 1 }, US: { label: 'lbf·in/in', factor: lbfPerNewton } },
  stiffnessA: { internal: 'N/mm', SI: { label: 'N/mm', factor: 1 }, US: { label: 'lbf/in', factor: lbfPerNewton * MILLIMETRES_PER_INCH } },
  stiffnessB: { internal: 'N', SI: { label: 'N', factor: 1 }, US: { label: 'lbf', factor: lbfPerNewton } },
  stiffnessD: { internal: 'N·mm', SI: { label: 'N·mm', factor: 1 }, US: { label: 'lbf·in', factor: lbfPerNewton * inchPerMm } },
  stiffnessH: { internal: 'N/mm', SI: { label: 'N/mm', factor: 1 }, US: { label: 'lbf/in', factor: lbfPerNewton * MILLIMETRES_PER_INCH } },
  curvature: { internal: '1/mm', SI: { label: '1/mm', factor: 1 }, US: { label: '1/in', factor: MILLIMETRES_PER_INCH } },
  strain: { internal: '1', SI: { label: 'µε', factor: 1e6 }, US: { label: 'µε', factor: 1e6 } },
  temperature: {
    internal: '°C',
    SI: { label: '°C', factor: 1 },
    US: { label: '°F', factor: 1 / KELVIN_PER_FAHRENHEIT_DEGREE, offset: 32 },
  },
  temperatureDifference: { internal: 'K', SI: { label: 'K', factor: 1 }, US: { label: '°F', factor: 1 / KELVIN_PER_FAHRENHEIT_DEGREE } },
  expansion: { internal: '1/K', SI: { label: 'µε/K', factor: 1e6 }, US: { label: 'µε/°F', factor: 1e6 * KELVIN_PER_FAHRENHEIT_DEGREE } },
  density: { internal: 'kg/m³', SI: { label: 'kg/m³', factor: 1 }, US: { label: 'lb/in³', factor: (1e-3 * MILLIMETRES_PER_INCH) ** 3 / KILOGRAMS_PER_POUND } },
  arealMass: { internal: 'kg/m²', SI: { label: 'kg/m²', factor: 1 }, US: { label: 'lb/ft²', factor: (12 * 1e-3 * MILLIMETRES_PER_INCH) ** 2 / KILOGRAMS_PER_POUND } },
};

/** The internal value shown in `system`. */
export function toDisplay(value: number, quantity: Quantity, system: UnitSystem): number {
  const unit = UNITS[quantity][system];
  return value * unit.factor + (unit.offset ?? 0);
}

/** A value typed in `system` back to internal units (the inverse of toDisplay). */
export function fromDisplay(value: number, quantity: Quantity, system: UnitSystem): number {
  const unit = UNITS[quantity][system];
  return (value - (unit.offset ?? 0)) / unit.factor;
}

/** The unit label shown beside a value of `quantity` in `system`. */
export function unitLabel(quantity: Quantity, system: UnitSystem): string {
  return UNITS[quantity][system].label;
}

/** The API's unit of `quantity`, for tooltips and notes. */
export function internalUnitLabel(quantity: Quantity): string {
  return UNITS[quantity].internal;
}
