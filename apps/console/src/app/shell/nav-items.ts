import { can, type Capability, type Role } from '@tallyfit/contracts';

export interface NavItem {
  path: string;
  label: string;
  icon: string;
  /** Who sees the link: those with this capability; everyone signed in when absent. */
  capability?: Capability;
  /** Active only on exactly this path (so "My analyses" is not lit on a single analysis). */
  exact?: boolean;
}

/** The main places, in order. A role only sees the places it can use. */
export const MAIN_NAV: readonly NavItem[] = [
  { path: '/studies', label: 'Studies', icon: 'folder_open' },
  { path: '/history', label: 'History', icon: 'history' },
  { path: '/reviews', label: 'To review', icon: 'fact_check', capability: 'analyses.review' },
  { path: '/watches', label: 'Watches', icon: 'monitor_heart', capability: 'watches.read' },
  { path: '/analyses', label: 'My analyses', icon: 'list_alt', exact: true },
  { path: '/analyses/new', label: 'New analysis', icon: 'add_chart', capability: 'analyses.run' },
  // The planner computes in the browser with the engine, which every role may use.
  { path: '/planner', label: 'Planner', icon: 'query_stats', capability: 'engine.compute' },
];

/** The admin area's places. */
export const ADMIN_NAV: readonly NavItem[] = [
  { path: '/admin/people', label: 'People', icon: 'group', capability: 'people.manage' },
  { path: '/admin/audit', label: 'Audit trail', icon: 'policy', capability: 'audit.read' },
  { path: '/admin/outbox', label: 'Mail outbox', icon: 'outgoing_mail', capability: 'outbox.read' },
];

/**
 * Where a person lands after signing in: those who review but do not run analyses start at their
 * review queue, everyone else at their own analyses.
 */
export function homePath(role: Role | null): string {
  return can(role, 'analyses.review') && !can(role, 'analyses.run') ? 'reviews' : 'analyses';
}

export function visibleTo(items: readonly NavItem[], role: Role | null): NavItem[] {
  return items.filter((item) => role !== null && (!item.capability || can(role, item.capability)));
}
