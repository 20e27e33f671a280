import type { WatchDetail } from '@tallyfit/contracts';
import { createRequestFrom, draftFromWatch, hypothesisWords, labelsFrom, nextRuns, updateRequestFrom, type WatchDraft } from './watch-draft';

const draft = (change: Partial<WatchDraft> = {}): WatchDraft => ({
  studyId: 4,
  name: 'Checkout split',
  description: '',
  labels: 'control, redesign',
  alpha: 0.05,
  feedKind: 'push',
  connectionId: null,
  query: '',
  schedule: '',
  timezone: '',
  webhookUrl: '',
  webhookSecret: '',
  ...change,
});

function stored(change: Partial<WatchDetail> = {}): WatchDetail {
  return {
    id: 3,
    study: { id: 4, name: 'Bramblewick Goods' },
    name: 'Checkout split',
    description: null,
    labels: ['control', 'redesign'],
    hypothesis: { kind: 'equal' },
    alpha: 0.05,
    feed: { kind: 'push' },
    webhook: { url: 'https://hooks.example.org/t', hasSecret: true, signatureHeader: 'X-Tallyfit-Signature' },
    state: 'holding',
    alarm: false,
    alertState: 'none',
    batchCount: 0,
    n: 0,
    sequentialP: 1,
    lastBatchAt: null,
    lastPeriodEnd: null,
    lastError: null,
    lastErrorAt: null,
    nextPullAt: null,
    createdBy: { id: 2, name: 'Ana Analyst' },
    createdAt: '2026-12-02T10:00:00Z',
    updatedAt: '2026-12-02T10:00:00Z',
    shares: [],
    ...change,
  };
}

describe('the watch form', () => {
  it('reads categories one per line, or separated by commas on one line', () => {
    expect(labelsFrom('control, redesign')).toEqual(['control', 'redesign']);
    expect(labelsFrom('north\n south, east \n\nwest')).toEqual(['north', 'south, east', 'west']);
  });

  it('builds a pushed watch with a webhook', () => {
    const outcome = createRequestFrom(draft({ webhookUrl: 'http://127.0.0.1:9/hook', webhookSecret: 'a-secret-of-sixteen+' }), { kind: 'equal' });
    expect(outcome).toEqual({
      ok: true,
      request: {
        studyId: 4,
        name: 'Checkout split',
        labels: ['control', 'redesign'],
        hypothesis: { kind: 'equal' },
        alpha: 0.05,
        feed: { kind: 'push' },
        webhook: { url: 'http://127.0.0.1:9/hook', secret: 'a-secret-of-sixteen+' },
      },
    });
  });

  it('says what is wrong in the contract’s words, without repeating a missing choice', () => {
    const outcome = createRequestFrom(
      draft({ studyId: null, labels: 'a, a', alpha: 1.5, feedKind: 'pull', schedule: 'every hour', query: 'select 1' }),
      null,
    );
    expect(outcome.ok).toBe(false);
    const errors = outcome.ok ? [] : outcome.errors;
    expect(errors).toEqual(
      expect.arrayContaining([
        'Choose the study the watch belongs to.',
        'Say what shares are expected.',
        'Choose the database the query runs against.',
        'labels must be different from each other',
        'alpha must be below 1',
        expect.stringMatching(/^schedule is not a cron pattern/),
      ]),
    );
    expect(errors.some((message) => /studyId|connectionId/.test(message))).toBe(false);
  });

  it('sends only what changed, keeps the stored webhook secret, and leaves fixed fields alone once batches exist', () => {
    const watch = stored({ batchCount: 12 });
    const changed = updateRequestFrom(watch, { ...draftFromWatch(watch), name: 'Checkout split, all regions', labels: 'x\ny', alpha: 0.01 }, { kind: 'ratio', values: [1, 2] });
    expect(changed).toEqual({ ok: true, request: { name: 'Checkout split, all regions', alpha: 0.01 } });
    expect(updateRequestFrom(watch, draftFromWatch(watch), { kind: 'equal' })).toEqual({ ok: false, errors: ['Nothing has changed.'] });
    expect(updateRequestFrom(watch, { ...draftFromWatch(watch), webhookUrl: '' }, { kind: 'equal' })).toEqual({ ok: true, request: { webhook: null } });
  });

  it('changes categories and hypothesis before the first batch', () => {
    const watch = stored();
    const changed = updateRequestFrom(watch, { ...draftFromWatch(watch), labels: 'control\nredesign\nlegacy' }, { kind: 'ratio', values: [2, 2, 1] });
    expect(changed).toEqual({ ok: true, request: { labels: ['control', 'redesign', 'legacy'], hypothesis: { kind: 'ratio', values: [2, 2, 1] } } });
  });

  it('lists the next times a schedule fires, in its time zone', () => {
    const runs = nextRuns('0 6 * * *', 'Europe/Oslo', 2, new Date('2026-12-02T12:00:00Z'));
    // 06:00 in Oslo in winter (UTC+1) is 05:00 UTC.
    expect(runs?.map((run) => run.toISOString())).toEqual(['2026-12-03T05:00:00.000Z', '2026-12-04T05:00:00.000Z']);
    expect(nextRuns('every hour', '')).toBeNull();
  });

  it('says a fixed hypothesis in words', () => {
    expect(hypothesisWords({ kind: 'equal' }, ['a', 'b'])).toBe('Every category equally likely.');
    expect(hypothesisWords({ kind: 'proportions', values: [0.6, 0.4] }, ['a', 'b'])).toBe('Shares: a 0.6, b 0.4.');
    expect(hypothesisWords({ kind: 'ratio', values: [3, 1] }, ['dominant', 'recessive'])).toBe('The ratio 3:1 across dominant, recessive.');
  });
});
