/**
 * Shapes of the section export: what the writers take, and what the readers
 * give back. Matrices follow the laminate engine (api/src/laminate/types.ts):
 * indices 1, 2, 6 for x, y, xy; H = [[A44, A45], [A45, A55]] with 4 = yz and
 * 5 = xz.
 */
import type { LaminateStiffness, Matrix2, Matrix3, PlyInput } from '../laminate/types.ts';
import type { UnitSystemName } from './units.ts';

export type SectionFormat = 'nastran-pcomp' | 'nastran-pshell' | 'calculix' | 'general-shell' | 'json' | 'csv';

export const SECTION_FORMATS: readonly SectionFormat[] = ['nastran-pcomp', 'nastran-pshell', 'calculix', 'general-shell', 'json', 'csv'];

/** Engineering constants as the laminate engine reports them; keys starting with E or G are moduli (MPa), the rest ratios. */
export type EngineeringConstants = Record<string, Record<string, number | null | undefined>>;

/** What a section is written from: the engine's result for one laminate, internal units. */
export interface SectionSource {
  stiffness: LaminateStiffness;
  /** Stacking order, first ply at the bottom (z = -h/2), as given to the engine. */
  plies: PlyInput[];
  /** The laminate engine's version, written into every header. */
  engineVersion: string;
  /** Membrane and flexural constants (for JSON and CSV). */
  engineeringConstants?: EngineeringConstants;
}

/** Options a person chooses when exporting (all optional; see `resolveSectionOptions` for defaults). */
export interface SectionOptions {
  units?: UnitSystemName;
  /** Nastran property id (PCOMP or PSHELL). */
  propertyId?: number;
  /** First Nastran material id; further materials take the next ids. */
  materialId?: number;
  /** Element set the keyword-style sections apply to. */
  elset?: string;
  /**
   * Where the reference surface (the element nodes) lies, measured from the
   * laminate mid-plane along the element normal, as a fraction of the
   * thickness: 0 mid-plane, -0.5 bottom surface (first ply), 0.5 top. The same
   * convention as CalculiX's OFFSET (checked in the solver, see CONTEXT.md).
   */
  referenceOffset?: number;
  layupName?: string;
  layupRevision?: string;
  /** Which allowables the ply strengths are (e.g. "FR-UC300 RTD B-basis, approved 2025-03-02"). */
  allowables?: string;
  /** ISO date for the header; today (UTC) when absent. */
  date?: string;
  /** Nastran free field (comma separated, 16 characters a value) instead of small field. */
  freeField?: boolean;
  /** PCOMP failure theory field FT. */
  failureTheory?: 'HILL' | 'HOFF' | 'TSAI' | 'STRN';
  /** Laminate x axis and normal in model coordinates (for CalculiX *ORIENTATION); default global X and Z. */
  xAxis?: [number, number, number];
  normal?: [number, number, number];
}

export interface ResolvedSectionOptions {
  units: UnitSystemName;
  propertyId: number;
  materialId: number;
  elset: string;
  referenceOffset: number;
  layupName: string;
  layupRevision: string;
  allowables: string;
  date: string;
  freeField: boolean;
  failureTheory?: 'HILL' | 'HOFF' | 'TSAI' | 'STRN';
  xAxis: [number, number, number];
  normal: [number, number, number];
}

/** One export: the text and how to offer it as a file. */
export interface SectionFile {
  format: SectionFormat;
  text: string;
  fileName: string;
  contentType: string;
}

/**
 * What a reader rebuilds from a file, in the file's own unit system. A, B, D
 * are about the laminate mid-plane (readers of formats that store them about
 * the reference surface shift them back).
 */
export interface SectionReadBack {
  format: SectionFormat;
  unitSystem: UnitSystemName;
  thickness: number;
  referenceOffset: number;
  A: Matrix3;
  B: Matrix3;
  D: Matrix3;
  H?: Matrix2;
  arealMass?: number;
  plies?: PlyInput[];
  /** Largest rounding of a printed number relative to its value: the precision the format was printed to. */
  maxRelativeRounding: number;
}
