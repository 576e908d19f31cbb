import type { Role } from '../../../shared/api/types';

/** One entry of the side navigation. */
export interface NavItem {
  path: string;
  label: string;
  icon: string;
  /** Roles that see the entry. */
  roles: readonly Role[];
  /** Group heading the entry sits under. */
  group: string;
}

/** Side navigation, in display order; each role sees only its own entries. */
export const NAV_ITEMS: readonly NavItem[] = [
  { path: '/requests/mine', label: 'My requests', icon: 'folder_open', roles: ['submitter'], group: 'My work' },
  { path: '/requests/assigned', label: 'Assigned to me', icon: 'assignment_ind', roles: ['reviewer'], group: 'My work' },
  { path: '/me/expertise', label: 'My expertise', icon: 'psychology', roles: ['reviewer'], group: 'My work' },
  { path: '/requests/intake', label: 'Intake queue', icon: 'move_to_inbox', roles: ['head'], group: 'Office' },
  { path: '/workload', label: 'Workload', icon: 'groups', roles: ['head'], group: 'Office' },
  // Reviewers and administrators may read the settings; only the head edits them.
  { path: '/office/settings', label: 'Office settings', icon: 'tune', roles: ['head', 'reviewer', 'admin'], group: 'Office' },
  { path: '/admin/people', label: 'People and roles', icon: 'group', roles: ['admin'], group: 'Administration' },
  { path: '/admin/sign-in-mappings', label: 'Sign-in mappings', icon: 'key', roles: ['admin'], group: 'Administration' },
  { path: '/admin/audit', label: 'Audit log', icon: 'history', roles: ['admin'], group: 'Administration' },
  { path: '/admin/outbox', label: 'Outbox (development)', icon: 'outgoing_mail', roles: ['admin'], group: 'Administration' },
];

/** Entries visible to a person holding `roles`. */
export function navItemsFor(roles: readonly Role[]): NavItem[] {
  return NAV_ITEMS.filter((item) => item.roles.some((r) => roles.includes(r)));
}

// Where each role starts its day; a person with several roles starts at the most senior one's page.
const START_PAGES: readonly [Role, string][] = [
  ['head', '/requests/intake'],
  ['reviewer', '/requests/assigned'],
  ['submitter', '/requests/mine'],
  ['admin', '/admin/people'],
];

/** The page a person lands on after sign-in, or null when their roles open no page. */
export function firstAllowedPath(roles: readonly Role[]): string | null {
  return START_PAGES.find(([role]) => roles.includes(role))?.[1] ?? null;
}
