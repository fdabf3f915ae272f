/**
 * Fixtures of the layup and export suites, built through the API as people
 * would: a ply material of the suite's own with coupons for every lamina
 * field (tension 0/90, compression 0/90, in-plane shear; RTD), an approved
 * B-basis allowable from an analysis, and its superseding revision.
 * Coupon values are invented (a carbon/epoxy tape's usual orders of size).
 */
import { couponRows, createMaterial, csvOf, getJson, postJson, upload, type CouponRow } from './coupon-chain-helpers.ts';

export { getJson, postJson, session } from './coupon-chain-helpers.ts';

export interface LaminaMaterial {
  id: number;
  code: string;
  conditionId: number;
}

/** Invented coupon means per property: strength MPa, modulus GPa, Poisson's ratio. */
const PROPERTIES = [
  { property: 'tension-0', testMethod: 'ASTM D3039', strength: 2100, modulus: 135, poisson: 0.3 },
  { property: 'tension-90', testMethod: 'ASTM D3039', strength: 55, modulus: 9, poisson: 0.02 },
  { property: 'compression-0', testMethod: 'ASTM D6641', strength: 1250, modulus: 125, poisson: 0.3 },
  { property: 'compression-90', testMethod: 'ASTM D6641', strength: 190, modulus: 9.5, poisson: 0.02 },
  { property: 'in-plane-shear', testMethod: 'ASTM D3518', strength: 85, modulus: 4.8, poisson: 0.3 },
];

/** A ply material with valid coupons for E1, E2, G12, nu12 and every strength in RTD. */
export async function laminaMaterial(): Promise<LaminaMaterial> {
  const material = await createMaterial({ name: 'Layup test tape (invented)', densityKgM3: 1550 });
  const rows: CouponRow[] = PROPERTIES.flatMap((p) => couponRows(material.code, { property: p.property, testMethod: p.testMethod, strength: p.strength, prefix: `${material.code}-${p.property}` })
    .map((r) => ({ ...r, modulus_gpa: Number((p.modulus * (Number(r.strength_mpa) / p.strength)).toFixed(2)), poisson_ratio: p.poisson })));
  const sent = await upload(csvOf(rows), { fileName: `${material.code}.csv` });
  if (sent.status !== 201) throw new Error(`coupons not uploaded: ${sent.status} ${JSON.stringify(sent.body).slice(0, 500)}`);
  const conditions = await getJson('designer', '/api/v1/conditions');
  const rtd = conditions.body.items.find((c: { code: string }) => c.code === 'RTD');
  return { id: material.id, code: material.code, conditionId: rtd.id };
}

async function decide(login: string, id: number, comment: string) {
  const detail = await getJson(login, `/api/v1/allowables/${id}`);
  const res = await postJson(login, `/api/v1/allowables/${id}/approve`, { comment, signatureMeaning: detail.body.signatureMeanings.approve });
  if (res.status !== 200) throw new Error(`allowable ${id} not approved: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

/** Analysis -> proposal (materials engineer) -> approval (a quality reviewer): the approved B-basis allowable's id. */
export async function approvedAllowable(materialId: number, property: string, reviewer = 'quality'): Promise<number> {
  const analysis = await postJson('materials', '/api/v1/analyses', { materialId, property, conditions: ['RTD'] });
  if (analysis.status !== 201) throw new Error(`analysis failed: ${analysis.status} ${JSON.stringify(analysis.body).slice(0, 500)}`);
  const proposal = await postJson('materials', '/api/v1/allowables', { analysisId: analysis.body.id, basis: 'B', comment: 'for the layup suites' });
  if (proposal.status !== 201) throw new Error(`proposal failed: ${proposal.status} ${JSON.stringify(proposal.body).slice(0, 500)}`);
  return (await decide(reviewer, proposal.body.id, 'Reviewed with its analysis and coupons.')).id;
}

let layupCounter = 0;
/** A layup name unique in this run. */
export function layupName(prefix: string): string {
  layupCounter += 1;
  return `${prefix} ${Date.now().toString(36)}-${layupCounter}`;
}

/** The draft of a code with one lamina choice for every ply. */
export function codeDraft(name: string, code: string, material: LaminaMaterial, lamina: Record<string, unknown> = { source: 'typical', conditionId: material.conditionId }, extra: Record<string, unknown> = {}) {
  return { name, code, material: { materialId: material.id, lamina }, ...extra };
}
