/**
 * Uploads and coupons (specimens) as the API sends them
 * (api/src/coupons/coupons.wire.ts). Internal units: mm, N, MPa; strains
 * dimensionless.
 */
import { IdCode, PersonRef } from './catalogue-wire';

export interface Upload {
  readonly id: number;
  readonly fileName: string;
  readonly sha256: string;
  readonly sizeBytes: number;
  readonly rowCount: number;
  readonly contentType: string;
  readonly columnMapping: Readonly<Record<string, string>>;
  readonly units: Readonly<Record<string, string>>;
  readonly createdBatches: readonly string[];
  readonly createdPanels: readonly string[];
  readonly invented: boolean;
  readonly uploadedBy: PersonRef;
  readonly uploadedAt: string;
}

/** 201 of POST /uploads. */
export interface UploadResult {
  readonly upload: Upload;
  readonly columns: readonly { readonly field: string; readonly header: string; readonly unit: string | null }[];
  readonly ignoredColumns: readonly string[];
}

export type SpecimenStatus = 'valid' | 'excluded';

export interface Specimen {
  readonly id: number;
  readonly specimenCode: string;
  readonly material: IdCode;
  readonly batch: IdCode;
  readonly panel: IdCode | null;
  readonly testMethod: IdCode;
  readonly property: string;
  readonly condition: IdCode;
  readonly widthMm: number;
  readonly thicknessMm: number;
  readonly plyCount: number;
  readonly failureLoadN: number | null;
  readonly strengthMpa: number | null;
  readonly modulusMpa: number | null;
  readonly poissonRatio: number | null;
  readonly failureStrain: number | null;
  readonly failureMode: string | null;
  readonly testDate: string;
  readonly laboratory: string;
  readonly status: SpecimenStatus;
  readonly statusReason: string | null;
  readonly statusChangedBy: PersonRef | null;
  readonly statusChangedAt: string | null;
  readonly uploadId: number;
  readonly uploadRow: number;
}

/** The sort keys GET /specimens accepts (api/src/coupons/specimens.queries.ts SORTABLE). */
export type SpecimenSortKey =
  | 'specimenCode'
  | 'testDate'
  | 'strengthMpa'
  | 'modulusMpa'
  | 'thicknessMm'
  | 'widthMm'
  | 'status'
  | 'batch'
  | 'condition'
  | 'uploadedAt';

export interface SpecimenQuery {
  readonly material?: number | null;
  readonly property?: string | null;
  readonly condition?: string | null;
  readonly batch?: number | null;
  readonly upload?: number | null;
  readonly status?: SpecimenStatus | null;
  readonly q?: string | null;
  readonly sort: SpecimenSortKey;
  readonly order: 'asc' | 'desc';
  readonly page: number;
  readonly pageSize: number;
}

export interface SpecimenPage {
  readonly items: readonly Specimen[];
  readonly total: number;
  readonly page: number;
  readonly pageSize: number;
  readonly pageCount: number;
}

/** One refusal of an upload: `row` as a spreadsheet counts (header = 1). */
export interface UploadProblem {
  readonly row?: number;
  readonly column?: string;
  readonly field: string;
  readonly code?: string;
  readonly message: string;
  readonly fix?: string;
}
