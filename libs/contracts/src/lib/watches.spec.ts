import { createWatchRequestSchema, pushBatchRequestSchema, createConnectionRequestSchema, connectionSchema } from './watches';

describe('watch contracts', () => {
  const base = { studyId: 1, name: 'Checkout split', labels: ['blue', 'green'], hypothesis: { kind: 'equal' } };

  it('takes each feed kind and fills in alpha', () => {
    expect(createWatchRequestSchema.parse({ ...base, feed: { kind: 'push' } }).alpha).toBe(0.05);
    expect(createWatchRequestSchema.safeParse({ ...base, feed: { kind: 'upload' } }).success).toBe(true);
    const pull = { kind: 'pull', connectionId: 3, query: 'select 1', schedule: '*/15 * * * *', timezone: 'Europe/Oslo' };
    expect(createWatchRequestSchema.safeParse({ ...base, feed: pull }).success).toBe(true);
  });

  it('names a bad schedule, a bad time zone and repeated labels', () => {
    const messages = (body: unknown) => createWatchRequestSchema.safeParse(body).error?.issues.map((issue) => issue.message) ?? [];
    const pull = { kind: 'pull', connectionId: 3, query: 'select 1', schedule: 'every hour', timezone: 'Nowhere/Else' };
    const found = messages({ ...base, labels: ['a', 'a'], feed: pull });
    expect(found).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^schedule is not a cron pattern/),
        'timezone must be an IANA time zone such as Europe/Oslo or UTC',
        'labels must be different from each other',
      ]),
    );
  });

  it('refuses a push whose period ends before it starts', () => {
    const result = pushBatchRequestSchema.safeParse({
      idempotencyKey: 'k1',
      periodStart: '2026-12-02T10:00:00Z',
      periodEnd: '2026-12-02T09:00:00Z',
      counts: { blue: 1 },
    });
    expect(result.error?.issues[0]).toMatchObject({ message: 'periodStart must not be after periodEnd', path: ['periodEnd'] });
  });

  it('takes a password on the way in and has no field for it on the way out', () => {
    expect(createConnectionRequestSchema.parse({ name: 'events', host: 'db', database: 'shop', user: 'reader', password: 'pw' }).port).toBe(5432);
    expect(Object.keys(connectionSchema.shape)).not.toContain('password');
  });
});
