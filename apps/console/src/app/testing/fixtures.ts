import type { AnalysisSummary, Role, StudyDetail, User, WatchAlert, WatchBatch, WatchDetail } from '@tallyfit/contracts';

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

export function watchFixture(change: Partial<WatchDetail> = {}): WatchDetail {
  return {
    id: 3,
    study: { id: 4, name: 'Checkout traffic split' },
    name: 'Checkout redesign: traffic split',
    description: null,
    labels: ['control', 'redesign'],
    hypothesis: { kind: 'equal' },
    alpha: 0.05,
    feed: { kind: 'push' },
    webhook: null,
    state: 'alarm',
    alarm: true,
    alertState: 'waiting',
    batchCount: 2,
    n: 40_000,
    sequentialP: 0.0123,
    lastBatchAt: '2026-12-02T11:00:00.000Z',
    lastPeriodEnd: '2026-12-02T11:00:00.000Z',
    lastError: null,
    lastErrorAt: null,
    nextPullAt: null,
    createdBy: { id: 2, name: 'Ana Analyst' },
    createdAt: '2026-12-01T09:00:00.000Z',
    updatedAt: '2026-12-02T11:00:00.000Z',
    shares: [
      { label: 'control', expected: 0.5, estimate: 0.51, lower: 0.503, upper: 0.517 },
      { label: 'redesign', expected: 0.5, estimate: 0.49, lower: 0.483, upper: 0.497 },
    ],
    ...change,
  };
}

export function watchBatchFixture(sequence: number, change: Partial<WatchBatch> = {}): WatchBatch {
  return {
    id: 100 + sequence,
    watchId: 3,
    sequence,
    periodStart: '2026-12-02T10:00:00.000Z',
    periodEnd: '2026-12-02T11:00:00.000Z',
    counts: { control: 10_200, redesign: 9_800 },
    n: 20_000,
    idempotencyKey: `hour-${sequence}`,
    source: 'push',
    datasetId: null,
    analysisId: 200 + sequence,
    batchP: 0.0047,
    cumulativeN: 20_000 * sequence,
    sequentialP: 0.0123,
    logBayesFactor: 4.4,
    alarm: true,
    shares: watchFixture().shares,
    createdBy: { id: 2, name: 'Ana Analyst' },
    createdAt: '2026-12-02T11:00:05.000Z',
    ...change,
  };
}

export function watchAlertFixture(change: Partial<WatchAlert> = {}): WatchAlert {
  return {
    id: 7,
    watchId: 3,
    kind: 'alarm',
    batchId: 102,
    sequentialP: 0.0123,
    createdAt: '2026-12-02T11:00:05.000Z',
    acknowledgedBy: null,
    acknowledgedAt: null,
    note: null,
    deliveries: [
      { channel: 'email', target: 'analyst@example.org', status: 'delivered', attempts: 1, lastError: null, deliveredAt: '2026-12-02T11:00:06.000Z' },
      { channel: 'webhook', target: 'https://hooks.example.org/t', status: 'failed', attempts: 5, lastError: 'status 503', deliveredAt: null },
    ],
    ...change,
  };
}
