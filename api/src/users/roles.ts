/**
 * The roles of PRODUCT.md. The identifiers travel in the identity provider's
 * `roles` claim and are what `requireRole` checks; everything else about a role
 * is for people.
 */
export const ROLES = [
  { code: 'materials-engineer', label: 'Materials engineer', description: 'Registers material systems, batches and panels; uploads and analyses coupon results; proposes allowables.' },
  { code: 'designer', label: 'Designer', description: 'Composes layups from catalogued plies; reads stiffness, stresses, failure indices and margins.' },
  { code: 'quality', label: 'Quality reviewer', description: 'Reviews proposed allowables and approves or rejects them with a signed comment, never their own.' },
  { code: 'analyst', label: 'Analyst', description: 'Exports shell section properties of layups for finite-element solvers.' },
  { code: 'admin', label: 'Administrator', description: 'Manages users, roles and reference lists.' },
] as const;

export type RoleCode = (typeof ROLES)[number]['code'];

export const ROLE_CODES: readonly RoleCode[] = ROLES.map((r) => r.code);

export function isRoleCode(value: unknown): value is RoleCode {
  return typeof value === 'string' && (ROLE_CODES as readonly string[]).includes(value);
}
