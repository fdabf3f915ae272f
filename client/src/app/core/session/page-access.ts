import { Role } from './roles';

/** The pages of the application that are opened by role. */
export type PageKey =
  | 'home'
  | 'materials'
  | 'test-data'
  | 'allowables'
  | 'reviews'
  | 'layups'
  | 'sections'
  | 'administration';

/** Who may open a page: anyone signed in, or a holder of at least one of the roles. */
export type PageAudience = 'signed-in' | readonly Role[];

/**
 * The one table of page access, read by the side navigation and by the route
 * guard so the two never disagree. The API enforces what each role may change;
 * this only keeps people out of pages that have nothing for them.
 */
export const PAGE_AUDIENCE: Readonly<Record<PageKey, PageAudience>> = {
  home: 'signed-in',
  materials: ['materials-engineer', 'designer', 'quality', 'admin'],
  'test-data': ['materials-engineer', 'quality'],
  allowables: 'signed-in',
  reviews: ['quality'],
  layups: ['designer', 'analyst'],
  sections: ['analyst', 'designer'],
  administration: ['admin'],
};

export function mayOpen(audience: PageAudience, roles: readonly Role[]): boolean {
  return audience === 'signed-in' || audience.some((role) => roles.includes(role));
}
