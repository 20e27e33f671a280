import type { Role } from './roles';
import type { StudyRole } from './studies';

/**
 * What each role, and inside a study each study role, may do: written once, here. The API's route
 * table names one capability per route and its services check the study part; the console's
 * `can()` reads the same table to offer only what a person can do.
 *
 * `roles` is who may ask at all. `studyRoles`, where present, is what the caller must also be in the
 * study the action touches; admins act in every study without being members (DEVELOPERS.md,
 * "Capabilities").
 */
export interface CapabilityRule {
  roles: readonly Role[];
  studyRoles?: readonly StudyRole[];
  /** One line for the OpenAPI document and the docs. */
  description: string;
}

const EVERYONE: readonly Role[] = ['admin', 'lead', 'analyst', 'viewer'];
const RUNNERS: readonly Role[] = ['admin', 'analyst'];
const REVIEWERS: readonly Role[] = ['admin', 'lead'];

export const CAPABILITIES = {
  'account.use': { roles: EVERYONE, description: 'read one’s own account, change one’s password, keep personal API tokens' },
  'engine.compute': { roles: EVERYONE, description: 'compute an analysis without storing it' },
  'people.directory': { roles: EVERYONE, description: 'look up active people to add them to a study' },
  'people.manage': { roles: ['admin'], description: 'add people, change their roles, disable accounts, see and revoke anyone’s API tokens' },
  'outbox.read': { roles: ['admin'], description: 'read what the built-in mail stand-in received' },
  'audit.read': { roles: REVIEWERS, description: 'read the audit trail' },
  'studies.read': { roles: EVERYONE, description: 'read the studies one belongs to (leads and admins: every study)' },
  'studies.create': { roles: RUNNERS, description: 'create a study and become its owner' },
  'studies.manage': {
    roles: RUNNERS,
    studyRoles: ['owner'],
    description: 'rename, describe, archive or restore a study and manage its members (its owners and admins)',
  },
  'analyses.read': { roles: EVERYONE, description: 'read analyses, their versions, reports and comments' },
  'analyses.run': {
    roles: RUNNERS,
    studyRoles: ['owner', 'contributor'],
    description: 'run, edit, re-run, submit, withdraw and delete analyses in a study (and one’s own)',
  },
  'analyses.comment': { roles: EVERYONE, description: 'comment on an analysis one may read' },
  'analyses.review': { roles: REVIEWERS, description: 'sign off or return an analysis in review (never one’s own)' },
  'analyses.share': { roles: ['admin', 'lead', 'analyst'], description: 'e-mail an analysis one may read' },
  'datasets.read': { roles: EVERYONE, description: 'read a study’s datasets' },
  'datasets.add': {
    roles: RUNNERS,
    studyRoles: ['owner', 'contributor'],
    description: 'upload, count and delete datasets in a study',
  },
  'watches.read': { roles: EVERYONE, description: 'read the watches of the studies one reads, with their batches and alerts' },
  'watches.manage': {
    roles: RUNNERS,
    studyRoles: ['owner', 'contributor'],
    description: 'create, edit and delete watches in a study, and feed them batches (pushed or from a dataset)',
  },
  'watches.pause': {
    roles: ['admin', 'lead', 'analyst'],
    studyRoles: ['owner', 'contributor'],
    description: 'pause and resume a watch (leads in every study; analysts where they run analyses)',
  },
  'alerts.acknowledge': { roles: REVIEWERS, description: 'acknowledge a watch’s alarm with a note' },
  'connections.manage': {
    roles: RUNNERS,
    description: 'add, edit, test and delete connections to a team’s own databases (passwords are write-only)',
  },
} as const satisfies Record<string, CapabilityRule>;

export type Capability = keyof typeof CAPABILITIES;
export const CAPABILITY_NAMES = Object.keys(CAPABILITIES) as Capability[];

/** The study roles a capability asks for; undefined when it does not depend on the study. */
export const studyRolesFor = (capability: Capability): readonly StudyRole[] | undefined =>
  (CAPABILITIES[capability] as CapabilityRule).studyRoles;

/**
 * Whether a person may use a capability. Without `studyRole` it answers for the role alone (may
 * this person ask at all); with a study role (null for a non-member) it also applies the study
 * part of the rule. Admins pass every study check.
 */
export function can(role: Role | null | undefined, capability: Capability, studyRole?: StudyRole | null): boolean {
  if (role == null) return false;
  const rule: CapabilityRule = CAPABILITIES[capability];
  if (!rule.roles.includes(role)) return false;
  if (studyRole === undefined || !rule.studyRoles || role === 'admin') return true;
  return studyRole !== null && rule.studyRoles.includes(studyRole);
}

