/**
 * Row shape -> wire shape of allowables, and the fixed texts that travel with
 * them: the caution of PRODUCT.md and the statements a reviewer signs.
 */
import type { AllowableRow } from './allowables.queries.ts';

/** PRODUCT.md, "Cautions the product must show": shown wherever values are approved. */
export const ENGINEERING_CAUTION =
  'Allowables and laminate results support engineering judgement; they do not replace it. A basis value is only as good as the test programme behind it. ' +
  'Structures whose failure can hurt someone are certified under the applicable regulations and local codes, by licensed or authorised engineers.';

/** The meaning of each signature (what the reviewer declares by deciding), recorded with the decision. */
export const SIGNATURE_MEANINGS = {
  approve: 'I have reviewed this allowable with its analysis, coupon data and diagnostics, and I approve its value for design use.',
  reject: 'I have reviewed this allowable with its analysis, coupon data and diagnostics, and I reject it: its value is not to be used for design.',
} as const;

export interface AllowableLabels {
  materials: Map<number, string>;
  conditions: Map<number, string>;
}

export function toAllowable(row: AllowableRow, labels: AllowableLabels) {
  return {
    id: row.id,
    material: { id: row.material_id, code: labels.materials.get(row.material_id) ?? null },
    property: row.property_code,
    quantity: row.quantity,
    condition: { id: row.condition_id, code: labels.conditions.get(row.condition_id) ?? null },
    basis: row.basis,
    value: row.value,
    unit: row.unit,
    analysisId: row.analysis_id,
    method: row.method,
    provisional: row.provisional,
    revision: row.revision,
    status: row.status,
    proposer: { id: Number(row.proposer_id), name: row.proposer_name },
    proposalComment: row.proposal_comment,
    proposedAt: row.proposed_at,
    reviewer: row.reviewer_id === null ? null : { id: Number(row.reviewer_id), name: row.reviewer_name },
    decidedAt: row.decided_at,
    decisionComment: row.decision_comment,
    signatureMeaning: row.signature_meaning,
    supersedesId: row.supersedes_id,
    createdAt: row.created_at,
  };
}
export type Allowable = ReturnType<typeof toAllowable>;
