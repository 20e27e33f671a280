import type { AnalysisSummary, Role, StudyDetail, User } from '@tallyfit/contracts';

/** Signs a person in for a component test by storing the session the console reads at start. */
export function storeSession(role: Role, id = 1): User {
  const user: User = { id, email: `${role}@example.org`, name: `${role[0].toUpperCase()}${role.slice(1)} Person`, role };
  sessionStorage.setItem(
    'tallyfit.session',
    JSON.stringify({ accessToken: 't', expiresAt: Date.now() + 600_000, refreshToken: 'r', user }),
  );
  return user;
}

export function studyFixture(change: Partial<StudyDetail> = {}): StudyDetail {
  return {
    id: 4,
    name: 'Checkout traffic split',
    description: 'Is the split between variants what was configured?',
    createdBy: { id: 2, name: 'Ana Analyst' },
    createdAt: '2026-11-20T10:00:00.000Z',
    updatedAt: '2026-11-20T10:00:00.000Z',
    archived: false,
    archivedAt: null,
    memberCount: 2,
    analysisCount: 1,
    myStudyRole: 'owner',
    members: [
      { userId: 2, name: 'Ana Analyst', email: 'ana@example.org', role: 'analyst', studyRole: 'owner', addedAt: '2026-11-20T10:00:00.000Z' },
      { userId: 5, name: 'Vic Viewer', email: 'vic@example.org', role: 'viewer', studyRole: 'reader', addedAt: '2026-11-21T10:00:00.000Z' },
    ],
    ...change,
  };
}

export function analysisSummaryFixture(change: Partial<AnalysisSummary> = {}): AnalysisSummary {
  return {
    id: 11,
    title: 'Sign-up form: equal traffic?',
    notes: null,
    engineVersion: '1.0.0',
    author: { id: 2, name: 'Ana Analyst' },
    study: { id: 4, name: 'Checkout traffic split' },
    datasetId: null,
    status: 'in_review',
    version: 1,
    seriesId: 11,
    previousId: null,
    isLatest: true,
    createdAt: '2026-11-22T09:30:00.000Z',
    updatedAt: '2026-11-22T09:30:00.000Z',
    hypothesisKind: 'equal',
    n: 812,
    k: 2,
    p: 0.0179,
    alpha: 0.05,
    significant: true,
    tests: ['pearson', 'g'],
    ...change,
  };
}
