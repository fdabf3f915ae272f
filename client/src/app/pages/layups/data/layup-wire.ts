/**
 * The layup routes as the client sees them (contract: the issue-7 server's
 * api/src/layups OpenAPI fragment). Internal units: mm, MPa, N/mm, N·mm.
 */
import type {
  CriterionName,
  FirstPlyFailure,
  FlexuralConstants,
  LaminateAnalysis,
  LaminatePlyInput,
  LoadCase,
  Matrix,
  MembraneConstants,
  PlyMaterial,
} from '../../../shared/laminate/laminate-wire';
import type { Impact } from '../../../shared/impact-banner/impact';

export type Basis = 'A' | 'B';

/**
 * Where a ply's lamina data come from, in one condition: the material's
 * typical values (coupon means) or its ply property set at a basis
 * (allowables where they exist).
 */
export type LaminaChoice =
  | { readonly source: 'typical'; readonly conditionId: number }
  | { readonly source: 'ply-property-set'; readonly conditionId: number; readonly basis: Basis };

export interface DraftPly {
  readonly materialId: number;
  readonly thetaDeg: number;
  /** null: the material's nominal cured ply thickness */
  readonly thicknessMm: number | null;
  readonly lamina: LaminaChoice;
}

/** Loads and failure settings stored with a revision (same meaning as POST /laminates/analyze). */
export interface LayupSettings {
  readonly loads?: LoadCase;
  readonly criteria?: CriterionName[];
  readonly factorOfSafety?: number;
}

export interface LayupDraft {
  readonly name?: string;
  readonly description?: string;
  readonly comment?: string;
  readonly plies: readonly DraftPly[];
  readonly settings?: LayupSettings;
}

export interface CodeDraft {
  readonly name?: string;
  readonly code: string;
  readonly material: { readonly materialId: number; readonly lamina: LaminaChoice; readonly thicknessMm: number | null };
  readonly settings?: LayupSettings;
}

export type Approval = 'approved' | 'partly-approved' | 'unapproved' | 'typical';

export interface RevisionPly {
  readonly index: number;
  readonly materialId: number;
  readonly materialCode: string;
  readonly thetaDeg: number;
  readonly thicknessMm: number;
  readonly thicknessOverrideMm: number | null;
  readonly lamina: LaminaChoice & { readonly conditionCode?: string };
  readonly laminaIndex: number;
}

export interface LaminaField {
  readonly value: number;
  readonly origin: 'typical' | 'approved' | 'unapproved' | string;
  readonly allowableId?: number;
  readonly allowableStatus?: string;
}

export interface Lamina {
  readonly index: number;
  readonly materialId: number;
  readonly materialCode: string;
  readonly materialName: string;
  readonly source: 'typical' | 'ply-property-set';
  readonly conditionId: number | null;
  readonly conditionCode: string | null;
  readonly basis: Basis | null;
  readonly approval: Approval;
  readonly values: PlyMaterial;
  readonly fields: Readonly<Record<string, LaminaField>>;
}

/** POST /layups/preview: the draft computed on the catalogue as it is now, nothing stored. */
export interface LayupPreview {
  readonly plies: readonly RevisionPly[];
  readonly laminae: readonly Lamina[];
  readonly code: string;
  readonly plyCount: number;
  readonly thicknessMm: number;
  readonly laminate: { readonly plies: LaminatePlyInput[] };
  readonly analysis: LaminateAnalysis;
  readonly impact: readonly Impact[];
}

export interface PersonRef {
  readonly id: number;
  readonly name: string;
}

export interface LayupRevision extends LayupPreview {
  readonly id: number;
  readonly layupId: number;
  readonly revision: number;
  readonly isLatest: boolean;
  readonly name: string;
  readonly description: string | null;
  readonly comment: string | null;
  readonly createdAt: string;
  readonly createdBy: PersonRef;
  readonly settings: LayupSettings;
  readonly engineVersion: string;
  readonly exportCount: number;
}

export interface RevisionSummary {
  readonly id: number;
  readonly revision: number;
  readonly name: string;
  readonly comment: string | null;
  readonly code: string;
  readonly plyCount: number;
  readonly thicknessMm: number;
  readonly createdAt: string;
  readonly createdBy: PersonRef;
  readonly impactCount: number;
}

export interface LayupSummary {
  readonly id: number;
  readonly name: string;
  readonly description: string | null;
  readonly owner: PersonRef;
  readonly createdAt: string;
  readonly revisionCount: number;
  readonly latest: Omit<RevisionSummary, 'name' | 'comment' | 'impactCount'>;
  readonly impactCount: number;
}

export interface LayupDetail {
  readonly id: number;
  readonly name: string;
  readonly description: string | null;
  readonly owner: PersonRef;
  readonly createdAt: string;
  readonly revisions: readonly RevisionSummary[];
  readonly latest: LayupRevision;
}

export interface ComparisonSide {
  readonly revisionId: number;
  readonly layupId: number;
  readonly name: string;
  readonly revision: number;
  readonly code: string;
  readonly plyCount: number;
  readonly thicknessMm: number;
  readonly arealMass: number;
  readonly A: Matrix;
  readonly B: Matrix;
  readonly D: Matrix;
  readonly H: Matrix;
  readonly membrane: MembraneConstants;
  readonly flexural: FlexuralConstants;
  readonly firstPlyFailure: Partial<Record<CriterionName, FirstPlyFailure>> | null;
  readonly impact: readonly Impact[];
}

export interface Comparison {
  readonly loads: LoadCase | null;
  readonly criteria: CriterionName[];
  readonly factorOfSafety: number;
  readonly a: ComparisonSide;
  readonly b: ComparisonSide;
}
