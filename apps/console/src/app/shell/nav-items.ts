import type { Role } from '@tallyfit/contracts';

export interface NavItem {
  path: string;
  label: string;
  icon: string;
  /** Who sees the link; everyone signed in when absent. */
  roles?: readonly Role[];
  /** Active only on exactly this path (so "My analyses" is not lit on a single analysis). */
  exact?: boolean;
}

/** The main places, in order. A role only sees the places it can use. */
export const MAIN_NAV: readonly NavItem[] = [
  { path: '/studies', label: 'Studies', icon: 'folder_open' },
  { path: '/history', label: 'History', icon: 'history' },
  { path: '/watches', label: 'Watches', icon: 'monitor_heart' },
  { path: '/analyses', label: 'My analyses', icon: 'list_alt', exact: true },
  { path: '/analyses/new', label: 'New analysis', icon: 'add_chart', roles: ['admin', 'analyst'] },
  // Planning future checks is for those who run or direct them; viewers only read results.
  { path: '/planner', label: 'Planner', icon: 'query_stats', roles: ['admin', 'lead', 'analyst'] },
];

/** The admin area's places. */
export const ADMIN_NAV: readonly NavItem[] = [
  { path: '/admin/people', label: 'People', icon: 'group', roles: ['admin'] },
  { path: '/admin/audit', label: 'Audit trail', icon: 'policy', roles: ['admin', 'lead'] },
  { path: '/admin/outbox', label: 'Mail outbox', icon: 'outgoing_mail', roles: ['admin'] },
];

export function visibleTo(items: readonly NavItem[], role: Role | null): NavItem[] {
  return items.filter((item) => !item.roles || (role !== null && item.roles.includes(role)));
}
