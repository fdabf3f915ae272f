/**
 * The role identifiers the API grants (GET /api/v1/me → roles). A viewer holds
 * none of them and may still read everything; the API decides what each role
 * may change, the client only uses roles to choose what to show.
 */
export const ROLES = ['materials-engineer', 'designer', 'quality', 'analyst', 'admin'] as const;

export type Role = (typeof ROLES)[number];

/** Plain names for people, as shown in the interface. */
export const ROLE_LABELS: Readonly<Record<Role, string>> = {
  'materials-engineer': 'Materials engineer',
  designer: 'Designer',
  quality: 'Quality reviewer',
  analyst: 'Analyst',
  admin: 'Administrator',
};

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}
