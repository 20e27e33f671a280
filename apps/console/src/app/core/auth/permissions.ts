import type { Role } from '@tallyfit/contracts';

/**
 * What each role may do in the console, from DESIGN.md ("Users and roles"). The API enforces the
 * same rules; the console uses them to offer only what a person can actually do.
 */
const PERMISSIONS = {
  createStudy: ['admin', 'analyst'],
  archiveStudy: ['admin', 'lead', 'analyst'],
  manageMembers: ['admin', 'lead'],
  runAnalysis: ['admin', 'analyst'],
  review: ['admin', 'lead'],
  // Anyone who can read an analysis may comment on it (the API's rule).
  comment: ['admin', 'lead', 'analyst', 'viewer'],
  readAudit: ['admin', 'lead'],
  administer: ['admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return role != null && (PERMISSIONS[permission] as readonly Role[]).includes(role);
}
