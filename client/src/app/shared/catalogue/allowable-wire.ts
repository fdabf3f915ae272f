/**
 * Allowables and their review as the API sends them
 * (api/src/allowables/allowables.wire.ts). `value` is in `unit` (MPa, or 1
 * for a failure strain).
 */
import { AnalysisCoupon, AnalysisDetail } from './analysis-wire';
import { IdCode, PersonRef } from './catalogue-wire';
import { Upload } from './coupon-wire';

export type AllowableStatus = 'draft' | 'proposed' | 'approved' | 'rejected' | 'superseded';
export type AllowableQuantity = 'strength' | 'failure-strain';

export const ALLOWABLE_STATUSES: readonly AllowableStatus[] = ['draft', 'proposed', 'approved', 'rejected', 'superseded'];

export interface Allowable {
  readonly id: number;
  readonly material: IdCode;
  readonly property: string;
  readonly quantity: AllowableQuantity;
  readonly condition: IdCode;
  readonly basis: 'A' | 'B';
  readonly value: number;
  readonly unit: string;
  readonly analysisId: number;
  readonly method: string;
  readonly provisional: boolean;
  readonly revision: number;
  readonly status: AllowableStatus;
  readonly proposer: PersonRef;
  readonly proposalComment: string | null;
  readonly proposedAt: string | null;
  readonly reviewer: PersonRef | null;
  readonly decidedAt: string | null;
  readonly decisionComment: string | null;
  readonly signatureMeaning: string | null;
  readonly supersedesId: number | null;
  readonly createdAt: string;
}

export interface ReviewItem extends Allowable {
  readonly ownProposal: boolean;
}

/** A coupon of the analysis behind an allowable, with its status now. */
export interface ChainCoupon extends AnalysisCoupon {
  readonly status: 'valid' | 'excluded' | null;
  readonly statusReason: string | null;
}

export interface OutboxMessage {
  readonly id: number;
  readonly kind: string;
  readonly to: string;
  readonly subject: string;
  readonly link: string | null;
  readonly status: 'sent' | 'unsent';
  readonly sentAt: string | null;
  readonly createdAt: string;
}

export interface AllowableDetail extends Allowable {
  readonly supersededById: number | null;
  readonly history: readonly Allowable[];
  readonly chain: {
    readonly analysis: AnalysisDetail;
    readonly coupons: readonly ChainCoupon[];
    readonly uploads: readonly Upload[];
  };
  readonly notifications: readonly OutboxMessage[];
  readonly signatureMeanings: { readonly approve: string; readonly reject: string };
  readonly caution: string;
}

export interface AllowableFilter {
  readonly material?: number | null;
  readonly property?: string | null;
  readonly condition?: string | null;
  readonly basis?: 'A' | 'B' | null;
  readonly status?: readonly AllowableStatus[];
  readonly analysis?: number | null;
}

/** POST /allowables */
export interface AllowableProposal {
  readonly analysisId: number;
  readonly basis: 'A' | 'B';
  readonly condition?: string;
  readonly comment?: string;
  readonly submit: boolean;
}

export type Decision = 'approve' | 'reject';

/** GET /allowables/:id/impact (issue 7): the layup revisions and exports that used the allowable. */
export interface AllowableImpact {
  readonly allowableId: number;
  readonly status: AllowableStatus;
  readonly supersededBy: number | null;
  readonly layups: readonly {
    readonly layupId: number;
    readonly name: string;
    readonly revisionId: number;
    readonly revision: number;
    readonly isLatest: boolean;
  }[];
  readonly exports: readonly {
    readonly id: number;
    readonly layupId: number;
    readonly layupName: string;
    readonly layupRevision: number;
    readonly format: string;
    readonly fileName: string;
    readonly createdAt: string;
    readonly createdBy: PersonRef;
  }[];
}
