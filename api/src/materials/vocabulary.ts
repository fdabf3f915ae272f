/**
 * The catalogue's fixed words: material forms, test properties, the
 * quantities a coupon yields, and the reference lists every installation starts
 * with (the usual ASTM test methods and the usual environmental conditions).
 * The database checks hold the same lists; this file is what code and the
 * seed read.
 */

export const MATERIAL_FORMS = ['unidirectional-tape', 'woven-fabric', 'non-crimp-fabric', 'core'] as const;
export type MaterialForm = (typeof MATERIAL_FORMS)[number];

/** What a coupon yields besides its failure load: the columns of a specimen result. */
export const QUANTITIES = ['strength', 'modulus', 'failure-strain', 'poisson-ratio'] as const;
export type Quantity = (typeof QUANTITIES)[number];

/** Internal unit of each quantity (ENGINEERING.md section 1). */
export const QUANTITY_UNIT: Record<Quantity, string> = {
  strength: 'MPa',
  modulus: 'MPa',
  'failure-strain': '1',
  'poisson-ratio': '1',
};

export const DOMINANCES = ['fibre-dominated', 'matrix-dominated', 'not-applicable'] as const;
export type Dominance = (typeof DOMINANCES)[number];

export const MOISTURE_STATES = ['dry', 'wet', 'ambient'] as const;
export type MoistureState = (typeof MOISTURE_STATES)[number];

/** The loadings a coupon is tested in (the CSV column `property`). Directions are the ply's 1 (fibre) and 2 axes. */
export const TEST_PROPERTIES = [
  { code: 'tension-0', label: '0° (fibre direction) tension' },
  { code: 'tension-90', label: '90° (transverse) tension' },
  { code: 'compression-0', label: '0° (fibre direction) compression' },
  { code: 'compression-90', label: '90° (transverse) compression' },
  { code: 'in-plane-shear', label: 'In-plane shear (1-2)' },
  { code: 'short-beam-shear', label: 'Short-beam (interlaminar) shear' },
  { code: 'flatwise-tension', label: 'Flatwise tension (core)' },
  { code: 'core-shear', label: 'Core shear' },
] as const;

/**
 * The usual test methods and the properties each yields. Fibre-dominated
 * values are normalised to nominal cured ply thickness; 90° strength,
 * in-plane shear and short-beam shear are matrix-dominated and are not
 * (ENGINEERING.md 2.2; CMH-17-1G Vol. 1, 2.4.3). Core tests have no ply
 * thickness to normalise to.
 */
export const REFERENCE_TEST_METHODS = [
  {
    code: 'ASTM D3039', standardRef: 'ASTM D3039/D3039M', title: 'Tensile properties of polymer matrix composite materials',
    properties: [{ property: 'tension-0', dominance: 'fibre-dominated' }, { property: 'tension-90', dominance: 'matrix-dominated' }],
  },
  {
    code: 'ASTM D6641', standardRef: 'ASTM D6641/D6641M', title: 'Compressive properties by combined loading compression',
    properties: [{ property: 'compression-0', dominance: 'fibre-dominated' }, { property: 'compression-90', dominance: 'matrix-dominated' }],
  },
  {
    code: 'ASTM D3518', standardRef: 'ASTM D3518/D3518M', title: 'In-plane shear response by tensile test of a ±45° laminate',
    properties: [{ property: 'in-plane-shear', dominance: 'matrix-dominated' }],
  },
  {
    code: 'ASTM D7078', standardRef: 'ASTM D7078/D7078M', title: 'Shear properties by V-notched rail shear',
    properties: [{ property: 'in-plane-shear', dominance: 'matrix-dominated' }],
  },
  {
    code: 'ASTM D2344', standardRef: 'ASTM D2344/D2344M', title: 'Short-beam strength',
    properties: [{ property: 'short-beam-shear', dominance: 'matrix-dominated' }],
  },
  {
    code: 'ASTM C297', standardRef: 'ASTM C297/C297M', title: 'Flatwise tensile strength of sandwich constructions',
    properties: [{ property: 'flatwise-tension', dominance: 'not-applicable' }],
  },
  {
    code: 'ASTM C273', standardRef: 'ASTM C273/C273M', title: 'Shear properties of sandwich core materials',
    properties: [{ property: 'core-shear', dominance: 'not-applicable' }],
  },
] as const satisfies ReadonlyArray<{ code: string; standardRef: string; title: string; properties: ReadonlyArray<{ property: string; dominance: Dominance }> }>;

/**
 * The usual environmental conditions of qualification programmes (common
 * practice; temperatures as often chosen for epoxy systems, not from one source).
 */
export const REFERENCE_CONDITIONS = [
  { code: 'CTD', label: 'Cold temperature, dry', temperatureC: -54, moistureState: 'dry' },
  { code: 'RTD', label: 'Room temperature, dry', temperatureC: 23, moistureState: 'dry' },
  { code: 'ETD', label: 'Elevated temperature, dry', temperatureC: 82, moistureState: 'dry' },
  { code: 'ETW', label: 'Elevated temperature, wet (moisture-conditioned)', temperatureC: 82, moistureState: 'wet' },
] as const satisfies ReadonlyArray<{ code: string; label: string; temperatureC: number; moistureState: MoistureState }>;
