/**
 * One allowable a layup revision or an export was computed on that is no
 * longer approved (GET /layup-revisions/{id}, /exports/{id}: `impact`).
 */
export interface Impact {
  readonly allowableId: number;
  readonly status: 'superseded' | 'rejected';
  readonly supersededBy: number | null;
  readonly materialCode: string;
  readonly propertyCode: string;
  readonly quantity: string;
  readonly conditionCode: string | null;
  readonly basis: string | null;
  readonly revision: number;
  readonly fields: readonly string[];
}
