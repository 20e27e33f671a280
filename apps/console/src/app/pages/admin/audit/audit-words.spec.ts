import { auditRecordWords } from './audit-words';

describe('auditRecordWords', () => {
  it('adds nothing to a person’s own sign-in (never "Ada Admin signed in user 1")', () => {
    expect(auditRecordWords({ entityType: 'user', entityId: '1', actor: { id: 1 } })).toBeNull();
  });

  it('names the record another event touched in words', () => {
    expect(auditRecordWords({ entityType: 'analysis', entityId: '12', actor: { id: 1 } })).toBe('analysis 12');
    expect(auditRecordWords({ entityType: 'api-token', entityId: '3', actor: { id: 1 } })).toBe('API token 3');
    expect(auditRecordWords({ entityType: 'user', entityId: '4', actor: { id: 1 } })).toBe('person 4');
    expect(auditRecordWords({ entityType: 'study', entityId: null, actor: null })).toBeNull();
  });
});
