import type { WatchAlert } from '@tallyfit/contracts';
import { execFileSync } from 'node:child_process';
import { alarmToAcknowledge, deliveryText, furthestCategory, pFigure, pushExample, TOKEN_PLACEHOLDER, watchHeadline } from './watch-view';

function alert(change: Partial<WatchAlert>): WatchAlert {
  return {
    id: 1,
    watchId: 3,
    kind: 'alarm',
    batchId: 30,
    sequentialP: 0.001,
    createdAt: '2026-12-02T10:00:00.000Z',
    acknowledgedBy: null,
    acknowledgedAt: null,
    note: null,
    deliveries: [],
    ...change,
  };
}

describe('the watch page in words', () => {
  it('picks the category furthest from its expected share for the chart', () => {
    const shares = [
      { label: 'control', expected: 0.5, estimate: 0.503, lower: 0.5, upper: 0.506 },
      { label: 'redesign', expected: 0.3, estimate: 0.31, lower: 0.3, upper: 0.32 },
      { label: 'other', expected: 0.2, estimate: 0.187, lower: 0.18, upper: 0.19 },
    ];
    expect(furthestCategory(shares)).toBe('other');
    expect(furthestCategory([])).toBeNull();
  });

  it('says what the sequential test shows so far', () => {
    expect(watchHeadline({ alarm: false, batchCount: 0, n: 0, sequentialP: 1, alpha: 0.05 })).toBe(
      'No batches yet: the first one starts the sequential test.',
    );
    expect(watchHeadline({ alarm: true, batchCount: 30, n: 600_000, sequentialP: 0.0004, alpha: 0.05 })).toBe(
      'After 30 batches (600,000 observations) the sequential p is < .001, below alpha 0.05.',
    );
    expect(watchHeadline({ alarm: false, batchCount: 1, n: 1, sequentialP: 0.42, alpha: 0.01 })).toBe(
      'After 1 batch (1 observation) the sequential p is .420, not below alpha 0.01.',
    );
  });

  it('writes a p-value alone in a cell without its equals sign', () => {
    // APA style (common practice, no source): three decimals, no leading zero.
    expect(pFigure(0.0047)).toBe('.005');
    expect(pFigure(0.0004)).toBe('< .001');
    expect(pFigure(0.9996)).toBe('> .999');
  });

  it('offers the newest alarm for acknowledgement only while it waits', () => {
    const waiting = alert({ id: 2 });
    expect(alarmToAcknowledge({ alertState: 'waiting' }, [waiting, alert({ id: 1, kind: 'cleared' })])).toBe(waiting);
    expect(alarmToAcknowledge({ alertState: 'acknowledged' }, [waiting])).toBeNull();
    expect(alarmToAcknowledge({ alertState: 'waiting' }, [alert({ kind: 'cleared' })])).toBeNull();
    expect(alarmToAcknowledge({ alertState: 'waiting' }, [])).toBeNull();
  });

  it('tells each delivery’s fate', () => {
    const email = { channel: 'email', target: 'lee@example.org', status: 'delivered', attempts: 1, lastError: null, deliveredAt: 'x' } as const;
    expect(deliveryText(email)).toBe('E-mail to lee@example.org: delivered after 1 attempt');
    expect(
      deliveryText({ channel: 'webhook', target: 'https://hooks.example.org/t', status: 'failed', attempts: 5, lastError: 'status 500', deliveredAt: null }),
    ).toBe('Webhook to https://hooks.example.org/t: gave up after 5 attempts — status 500');
    expect(deliveryText({ ...email, status: 'pending', attempts: 2 })).toBe('E-mail to lee@example.org: still trying (2 attempts so far)');
  });

  describe('the example a pipeline copies', () => {
    const example = pushExample('https://tallyfit.example.org', { id: 7, labels: ['control', "Bob's variant"] }, new Date('2026-12-02T10:42:13Z'));

    it('posts to the watch’s batches with a token placeholder and the previous whole hour', () => {
      expect(example).toContain(`TALLYFIT_TOKEN='${TOKEN_PLACEHOLDER}'`);
      expect(example).toContain("-X POST 'https://tallyfit.example.org/api/v1/watches/7/batches'");
      expect(example).toContain('"periodStart": "2026-12-02T09:00:00Z"');
      expect(example).toContain('"periodEnd": "2026-12-02T10:00:00Z"');
    });

    it('is a command a POSIX shell reads back as the intended JSON body, quotes in labels included', () => {
      // Run the body through sh's own quoting: `printf %s` prints the argument curl would receive.
      const dataArgument = example.slice(example.indexOf("-d '") + 3);
      const printed = execFileSync('sh', ['-c', `printf %s ${dataArgument}`], { encoding: 'utf8' });
      expect(JSON.parse(printed)).toEqual({
        idempotencyKey: 'hour-2026-12-02T09:00:00Z',
        periodStart: '2026-12-02T09:00:00Z',
        periodEnd: '2026-12-02T10:00:00Z',
        counts: { control: 0, "Bob's variant": 0 },
      });
    });
  });
});
