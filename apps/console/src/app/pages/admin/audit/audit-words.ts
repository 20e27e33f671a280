import type { AuditAction } from '@tallyfit/contracts';

export const AUDIT_ACTION_WORDS: Record<AuditAction, string> = {
  create: 'Created',
  update: 'Changed',
  delete: 'Deleted',
  'sign-in': 'Signed in',
  'sign-in-failed': 'Failed sign-in',
  'sign-out': 'Signed out',
  'role-change': 'Role changed',
  review: 'Review decision',
  share: 'Shared',
  revoke: 'Revoked',
};

/** The kinds of record the API writes to the trail, with the words shown for them. */
export const AUDIT_RECORD_KINDS: ReadonlyArray<{ value: string; words: string }> = [
  { value: 'analysis', words: 'Analyses' },
  { value: 'study', words: 'Studies' },
  { value: 'study-member', words: 'Study members' },
  { value: 'dataset', words: 'Datasets' },
  { value: 'comment', words: 'Comments' },
  { value: 'user', words: 'People' },
  { value: 'api-token', words: 'API tokens' },
];

/** The record an event touched, in words ("analysis 12", "API token 3"); none where the summary already says it (a person's own sign-in). */
export function auditRecordWords(event: { entityType: string; entityId: string | null; actor: { id: number } | null }): string | null {
  if (!event.entityId) return null;
  if (event.entityType === 'user' && event.actor && String(event.actor.id) === event.entityId) return null;
  const kind = { 'api-token': 'API token', 'study-member': 'study member', user: 'person' }[event.entityType] ?? event.entityType;
  return `${kind} ${event.entityId}`;
}
