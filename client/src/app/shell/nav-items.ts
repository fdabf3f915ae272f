import { mayOpen, PAGE_AUDIENCE, PageKey } from '../core/session/page-access';
import { Role } from '../core/session/roles';

/** One entry of the side navigation; `key` is also the link's data-nav hook. */
export interface NavItem {
  readonly key: PageKey;
  readonly label: string;
  /** Ligature name in the packaged Material Icons font. */
  readonly icon: string;
  readonly path: string;
  /** One line for the home page: what the person does there. */
  readonly summary: string;
}

/** In the order of the chain: catalogue, test data, allowables, layups, sections. */
export const NAV_ITEMS: readonly NavItem[] = [
  {
    key: 'home',
    label: 'Home',
    icon: 'home',
    path: '/',
    summary: 'Start here.',
  },
  {
    key: 'materials',
    label: 'Materials',
    icon: 'inventory_2',
    path: '/materials',
    summary: 'Material systems, their batches, panels and specimens.',
  },
  {
    key: 'test-data',
    label: 'Test data',
    icon: 'science',
    path: '/test-data',
    summary: 'Upload coupon results by CSV and analyse data groups.',
  },
  {
    key: 'allowables',
    label: 'Allowables',
    icon: 'verified',
    path: '/allowables',
    summary: 'A- and B-basis values, proposed and approved, with their analyses.',
  },
  {
    key: 'reviews',
    label: 'Reviews',
    icon: 'fact_check',
    path: '/reviews',
    summary: 'Proposed allowables waiting for a quality decision.',
  },
  {
    key: 'layups',
    label: 'Layups',
    icon: 'layers',
    path: '/layups',
    summary: 'Stacking sequences, ABD matrices, ply stresses and margins.',
  },
  {
    key: 'sections',
    label: 'Sections',
    icon: 'view_in_ar',
    path: '/sections',
    summary: 'Shell section properties exported for finite-element solvers.',
  },
  {
    key: 'administration',
    label: 'Administration',
    icon: 'admin_panel_settings',
    path: '/administration',
    summary: 'Users, roles and reference lists.',
  },
];

/** The entries a person with these roles may open (the same table the route guard reads). */
export function navItemsFor(roles: readonly Role[]): readonly NavItem[] {
  return NAV_ITEMS.filter((item) => mayOpen(PAGE_AUDIENCE[item.key], roles));
}
