/**
 * The invented demo scenario of PRODUCT.md: "Fjordvik Rotorworks" qualifies
 * FR-UC300 (carbon/epoxy unidirectional tape), FR-GX800 (glass/epoxy ±45°
 * non-crimp fabric) and FR-C80 (PET foam core). Every number here is invented
 * for the demo: plausible for the material class, measured nowhere.
 */

export const DEMO_LABORATORY = 'Fjordvik Rotorworks materials laboratory (invented demo data)';
export const DEMO_CONDITIONS = ['CTD', 'RTD', 'ETD', 'ETW'] as const;
export type DemoCondition = (typeof DEMO_CONDITIONS)[number];

export interface DemoMaterial {
  code: string;
  name: string;
  form: 'unidirectional-tape' | 'non-crimp-fabric' | 'core';
  fibre: string;
  resin: string;
  nominalCuredPlyThicknessMm: number;
  fibreArealWeightGm2: number | null;
  resinContentPct: number | null;
  densityKgM3: number;
  specificationRef: string;
  batches: number;
}

export const DEMO_MATERIALS: DemoMaterial[] = [
  {
    code: 'FR-UC300', name: 'FR-UC300 carbon/epoxy unidirectional tape (invented)', form: 'unidirectional-tape', fibre: 'standard-modulus carbon (invented)',
    resin: 'toughened epoxy, 120 °C cure (invented)', nominalCuredPlyThicknessMm: 0.29, fibreArealWeightGm2: 300, resinContentPct: 33, densityKgM3: 1560,
    specificationRef: 'FRW-MS-0301 rev A (invented)', batches: 5,
  },
  {
    code: 'FR-GX800', name: 'FR-GX800 glass/epoxy ±45° biaxial non-crimp fabric (invented)', form: 'non-crimp-fabric', fibre: 'E-glass (invented)',
    resin: 'infusion epoxy (invented)', nominalCuredPlyThicknessMm: 0.6, fibreArealWeightGm2: 800, resinContentPct: 31, densityKgM3: 1900,
    specificationRef: 'FRW-MS-0802 rev A (invented)', batches: 3,
  },
  {
    code: 'FR-C80', name: 'FR-C80 PET foam core, 80 kg/m³ (invented)', form: 'core', fibre: 'none (foam core)', resin: 'PET foam (invented)',
    nominalCuredPlyThicknessMm: 25, fibreArealWeightGm2: null, resinContentPct: null, densityKgM3: 80, specificationRef: 'FRW-MS-1080 rev A (invented)', batches: 3,
  },
];

/** Condition effects on room-temperature values (invented, typical in direction and size for an epoxy system). */
export const CONDITION_FACTOR: Record<DemoCondition, { fibre: number; matrix: number; core: number }> = {
  CTD: { fibre: 1.04, matrix: 1.12, core: 1.1 },
  RTD: { fibre: 1, matrix: 1, core: 1 },
  ETD: { fibre: 0.97, matrix: 0.82, core: 0.85 },
  ETW: { fibre: 0.93, matrix: 0.64, core: 0.8 },
};

export interface DemoProgramme {
  material: string;
  testMethod: string;
  property: string;
  dominance: 'fibre' | 'matrix' | 'core';
  plyCount: number;
  widthMm: number;
  /** Room-temperature dry means (internal units: MPa; strain dimensionless). */
  strengthMpa: number;
  modulusMpa?: number;
  poissonRatio?: number;
  failureStrain?: number;
  /** Within-batch coefficient of variation of strength (fraction). */
  cv: number;
  specimensPerBatch: number;
  /** Per condition, where it differs from specimensPerBatch (RTD 0° tension: enough for an A-basis). */
  specimensPerBatchIn?: Partial<Record<DemoCondition, number>>;
  failureModes?: string[];
}

export const DEMO_PROGRAMME: DemoProgramme[] = [
  { material: 'FR-UC300', testMethod: 'ASTM D3039', property: 'tension-0', dominance: 'fibre', plyCount: 6, widthMm: 15, strengthMpa: 2300, modulusMpa: 135_000, poissonRatio: 0.31, failureStrain: 0.0165, cv: 0.045, specimensPerBatch: 6, specimensPerBatchIn: { RTD: 12 }, failureModes: ['LGM', 'XGM', 'AGM'] },
  { material: 'FR-UC300', testMethod: 'ASTM D3039', property: 'tension-90', dominance: 'matrix', plyCount: 12, widthMm: 25, strengthMpa: 55, modulusMpa: 9000, failureStrain: 0.0061, cv: 0.06, specimensPerBatch: 6, failureModes: ['LGM', 'AGM'] },
  { material: 'FR-UC300', testMethod: 'ASTM D6641', property: 'compression-0', dominance: 'fibre', plyCount: 12, widthMm: 13, strengthMpa: 1300, modulusMpa: 125_000, failureStrain: 0.0105, cv: 0.055, specimensPerBatch: 6 },
  { material: 'FR-UC300', testMethod: 'ASTM D6641', property: 'compression-90', dominance: 'matrix', plyCount: 16, widthMm: 13, strengthMpa: 210, modulusMpa: 9500, cv: 0.05, specimensPerBatch: 6 },
  { material: 'FR-UC300', testMethod: 'ASTM D3518', property: 'in-plane-shear', dominance: 'matrix', plyCount: 16, widthMm: 25, strengthMpa: 95, modulusMpa: 4800, failureStrain: 0.05, cv: 0.04, specimensPerBatch: 6 },
  { material: 'FR-UC300', testMethod: 'ASTM D2344', property: 'short-beam-shear', dominance: 'matrix', plyCount: 20, widthMm: 12, strengthMpa: 85, cv: 0.04, specimensPerBatch: 6 },
  { material: 'FR-GX800', testMethod: 'ASTM D3039', property: 'tension-0', dominance: 'fibre', plyCount: 4, widthMm: 25, strengthMpa: 190, modulusMpa: 13_000, poissonRatio: 0.55, cv: 0.05, specimensPerBatch: 6, failureModes: ['LGM', 'AGM'] },
  { material: 'FR-GX800', testMethod: 'ASTM D6641', property: 'compression-0', dominance: 'fibre', plyCount: 6, widthMm: 13, strengthMpa: 170, modulusMpa: 12_500, cv: 0.06, specimensPerBatch: 6 },
  { material: 'FR-GX800', testMethod: 'ASTM D3518', property: 'in-plane-shear', dominance: 'matrix', plyCount: 6, widthMm: 25, strengthMpa: 120, modulusMpa: 9800, cv: 0.05, specimensPerBatch: 6 },
  { material: 'FR-C80', testMethod: 'ASTM C297', property: 'flatwise-tension', dominance: 'core', plyCount: 1, widthMm: 50, strengthMpa: 1.4, cv: 0.07, specimensPerBatch: 5 },
  { material: 'FR-C80', testMethod: 'ASTM C273', property: 'core-shear', dominance: 'core', plyCount: 1, widthMm: 50, strengthMpa: 0.9, modulusMpa: 20, cv: 0.06, specimensPerBatch: 5 },
];
