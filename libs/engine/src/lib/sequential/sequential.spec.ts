import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { EngineInputError } from '../spec/engine-input-error';
import { expectClose } from '../../testing/expect-close';
import { analyzeSequential } from './analyze-sequential';
import { logBayesFactor } from './dirichlet-mixture';
import { shareConfidenceInterval } from './share-confidence-sequence';
import { addSequentialBatch, startSequential, type SequentialState } from './sequential-state';
import { DEFAULT_CONCENTRATION, type SequentialSpec } from './sequential-spec';

/** Written by tools/fixtures/sequential-reference.py (mpmath 1.3.0, 50 digits) from the formulas. */
interface Reference {
  mpmath: string;
  streams: {
    name: string;
    shares: number[];
    concentration: number;
    alpha: number;
    batches: number[][];
    looks: { n: number; logBayesFactor: number; p: number }[];
  }[];
  intervals: { x: number; n: number; a: number; b: number; alpha: number; lower: number; upper: number }[];
}
const reference: Reference = JSON.parse(readFileSync(join(__dirname, 'sequential-reference.json'), 'utf8'));

const labelsFor = (k: number) => Array.from({ length: k }, (_, i) => `group ${i + 1}`);

function errorOf(run: () => unknown): EngineInputError {
  try {
    run();
  } catch (error) {
    if (error instanceof EngineInputError) return error;
    throw error;
  }
  throw new Error('expected an EngineInputError');
}

describe('the Dirichlet–multinomial Bayes factor and sequential p', () => {
  it('matches the hand-computed case: BF = x1! x2! 2^n / (n + 1)! under a uniform prior', () => {
    // Two equal shares, Dirichlet(1, 1) (c = 2): BF_n = Γ(2)/Γ(2 + n) · x1! x2! / 2^−n.
    // Counts (3, 1): 3!·1!·2⁴/5! = 4/5; (5, 3): 5!·3!·2⁸/9! = 32/63; (10, 3): 10!·3!·2¹³/14! = 2048/1001.
    const result = analyzeSequential({
      observed: { labels: ['left', 'right'] },
      hypothesis: { kind: 'equal' },
      concentration: 2,
      batches: [[3, 1], [2, 2], [5, 0]],
    });
    const expected = [4 / 5, 32 / 63, 2048 / 1001];
    result.looks.forEach((look, i) => expectClose(Math.exp(look.logBayesFactor), expected[i], { relative: 1e-13 }, `BF at look ${i + 1}`));
    expect(result.looks.map((look) => look.n)).toEqual([4, 8, 13]);
    // p = min(1, 1/BF so far): 1, 1, then 1001/2048.
    expect(result.looks[0].p).toBe(1);
    expect(result.looks[1].p).toBe(1);
    expectClose(result.looks[2].p, 1001 / 2048, { relative: 1e-13 }, 'p at look 3');
  });

  it.each(reference.streams.map((stream) => [stream.name, stream] as const))('matches mpmath %s', (_name, stream) => {
    expect(reference.mpmath).toBe('1.3.0');
    const result = analyzeSequential({
      observed: { labels: labelsFor(stream.shares.length) },
      hypothesis: { kind: 'proportions', values: stream.shares },
      concentration: stream.concentration,
      alpha: stream.alpha,
      batches: stream.batches,
    });
    stream.looks.forEach((want, i) => {
      const look = result.looks[i];
      expect(look.n).toBe(want.n);
      // ln BF is a difference of terms of size about n; doubles hold the shares to 1e-16, so
      // the attainable absolute accuracy is about 1e-16 · n.
      const tolerance = Math.max(1e-12, 4e-16 * want.n);
      expectClose(look.logBayesFactor, want.logBayesFactor, { absolute: tolerance }, `${stream.name}: ln BF at look ${i + 1}`);
      expectClose(look.p, want.p, { relative: 2 * tolerance }, `${stream.name}: p at look ${i + 1}`);
      expect(look.alarm).toBe(want.p <= stream.alpha);
    });
  });

  it('gives ln BF = 0 before any observation and for an empty batch keeps the look unchanged', () => {
    expect(logBayesFactor([0, 0, 0], [20, 30, 50], [0.2, 0.3, 0.5])).toBe(0);
    const result = analyzeSequential({
      observed: { labels: ['a', 'b'] },
      hypothesis: { kind: 'equal' },
      batches: [[0, 0], [60, 40], [0, 0]],
    });
    expect(result.looks[0]).toMatchObject({ n: 0, p: 1, logBayesFactor: 0, alarm: false });
    expect(result.looks[0].shares[0]).toMatchObject({ estimate: 0.5, lower: 0, upper: 1 });
    expect(result.looks[2].p).toBe(result.looks[1].p);
    expect(result.looks[2].logBayesFactor).toBe(result.looks[1].logBayesFactor);
  });
});

describe('the anytime-valid p and the alarm', () => {
  // A stream that drifts away from 50/50 and then returns: ln BF rises, then falls.
  const spec: SequentialSpec = {
    observed: { labels: ['control', 'variant'] },
    hypothesis: { kind: 'equal' },
    batches: [[500, 500], [560, 440], [570, 430], [580, 420], [450, 550], [400, 600], [500, 500], [300, 700]],
  };
  const result = analyzeSequential(spec);

  it('never increases, even when the evidence against the null falls back', () => {
    const logBf = result.looks.map((look) => look.logBayesFactor);
    expect(logBf[4]).toBeLessThan(logBf[3]); // the evidence did fall back…
    for (let i = 1; i < result.looks.length; i++) expect(result.looks[i].p).toBeLessThanOrEqual(result.looks[i - 1].p);
    // …and p is the running minimum of min(1, 1/BF).
    let running = 1;
    result.looks.forEach((look) => {
      running = Math.min(running, Math.exp(-look.logBayesFactor));
      expect(look.p).toBe(running);
    });
  });

  it('raises the alarm when p ≤ α and keeps it raised; firstAlarm is that batch', () => {
    const firstAlarm = result.looks.findIndex((look) => look.p <= 0.05) + 1;
    expect(firstAlarm).toBeGreaterThan(1);
    expect(result.firstAlarm).toBe(firstAlarm);
    result.looks.forEach((look) => expect(look.alarm).toBe(look.batch >= firstAlarm));
    expect(result.looks.map((look) => look.batch)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
  });

  it('alarms later (or not at all) at a smaller α, and reports null when it never alarms', () => {
    const strict = analyzeSequential({ ...spec, alpha: 1e-6 });
    expect(strict.firstAlarm === null || strict.firstAlarm > result.firstAlarm!).toBe(true);
    const quiet = analyzeSequential({ ...spec, batches: [[500, 500], [490, 510], [505, 495]] });
    expect(quiet.firstAlarm).toBeNull();
    expect(quiet.looks.every((look) => !look.alarm)).toBe(true);
  });

  it('reports the defaults: α = 0.05, concentration 100, and the engine version', () => {
    expect(result).toMatchObject({ alpha: 0.05, concentration: DEFAULT_CONCENTRATION, expectedShares: [0.5, 0.5], labels: ['control', 'variant'] });
    expect(DEFAULT_CONCENTRATION).toBe(100);
    expect(result.engineVersion).toMatch(/^\d+\.\d+\.\d+/);
  });
});

describe('addSequentialBatch', () => {
  it('folds to the same looks as analyzeSequential, from a state stored as JSON', () => {
    const batches = [[30, 52, 18], [25, 49, 26], [40, 90, 30], [22, 60, 38]];
    const whole = analyzeSequential({ observed: { labels: ['a', 'b', 'c'] }, hypothesis: { kind: 'ratio', values: [1, 2, 1] }, batches });
    let state: SequentialState = startSequential({ observed: { labels: ['a', 'b', 'c'] }, hypothesis: { kind: 'ratio', values: [1, 2, 1] } });
    expect(state).toEqual({ labels: ['a', 'b', 'c'], expectedShares: [0.25, 0.5, 0.25], alpha: 0.05, concentration: 100, counts: [0, 0, 0], batches: 0, p: 1 });
    batches.forEach((batch, i) => {
      const before = JSON.stringify(state);
      const step = addSequentialBatch(JSON.parse(before), batch);
      expect(JSON.stringify(state)).toBe(before); // the old state is not changed
      expect(step.look).toEqual(whole.looks[i]);
      state = step.state;
    });
    expect(state).toMatchObject({ counts: [117, 251, 112], batches: 4, p: whole.looks[3].p });
  });

  it('names the field of an invalid batch or state', () => {
    const state = startSequential({ observed: { labels: ['a', 'b'] }, hypothesis: { kind: 'equal' } });
    expect(errorOf(() => addSequentialBatch(state, [1, 2, 3])).issues).toEqual([
      { path: 'counts', message: 'the batch has 3 counts but there are 2 categories' },
    ]);
    expect(errorOf(() => addSequentialBatch(state, [1, -2])).issues).toEqual([{ path: 'counts.1', message: 'counts must not be negative' }]);
    expect(errorOf(() => addSequentialBatch({ ...state, counts: [1] }, [1, 2])).issues).toEqual([
      { path: 'state.counts', message: 'counts has 1 entries but there are 2 labels' },
    ]);
    expect(errorOf(() => addSequentialBatch({ ...state, p: 2 }, [1, 2])).issues).toEqual([{ path: 'state.p', message: 'p must be at most 1' }]);
    expect(errorOf(() => addSequentialBatch({ ...state, expectedShares: [0.5, 0.6] }, [1, 2])).issues).toEqual([
      { path: 'state.expectedShares', message: 'expectedShares must sum to 1' },
    ]);
  });
});

describe('input errors', () => {
  const base = { observed: { labels: ['a', 'b'] }, hypothesis: { kind: 'equal' }, batches: [[1, 2]] } as SequentialSpec;
  it.each([
    ['expected counts', { hypothesis: { kind: 'counts', values: [5, 5] } }, 'hypothesis.kind', 'a sequential test needs shares fixed in advance: use equal, proportions or ratio (counts depends on the data)'],
    ['a fitted distribution', { hypothesis: { kind: 'distribution', family: 'poisson' } }, 'hypothesis.kind', 'a sequential test needs shares fixed in advance: use equal, proportions or ratio (distribution depends on the data)'],
    ['estimated parameters', { hypothesis: { kind: 'equal', estimatedParameters: 1 } }, 'hypothesis.estimatedParameters', 'a sequential test needs shares fixed in advance, not estimated from the data'],
    ['a zero share', { hypothesis: { kind: 'ratio', values: [1, 0] } }, 'hypothesis.values.1', 'category "b" has an expected share of 0: a sequential test needs every share above 0'],
    ['proportions off 1', { hypothesis: { kind: 'proportions', values: [0.5, 0.4] } }, 'hypothesis.values', 'proportions must sum to 1; they sum to 0.9'],
    ['a short batch', { batches: [[1, 2], [3]] }, 'batches.1', 'batches.1 has 1 counts but there are 2 categories'],
    ['a fractional count', { batches: [[1, 2.5]] }, 'batches.0.1', 'counts must be whole numbers'],
    ['one category', { observed: { labels: ['a'] }, batches: [[1]] }, 'observed.labels', 'at least 2 categories are needed, got 1'],
    ['observed counts', { observed: { labels: ['a', 'b'], counts: [1, 2] } }, 'observed', 'Unrecognized key: "counts"'],
    ['alpha of 1', { alpha: 1 }, 'alpha', 'alpha must be below 1'],
    ['a zero concentration', { concentration: 0 }, 'concentration', 'concentration must be above 0'],
  ])('refuses %s, naming the field', (_what, change, path, message) => {
    const issues = errorOf(() => analyzeSequential({ ...base, ...change } as SequentialSpec)).issues;
    expect(issues).toContainEqual({ path, message });
  });

  it('rescales proportions rounded to published precision, with a warning', () => {
    const result = analyzeSequential({ ...base, hypothesis: { kind: 'proportions', values: [0.333, 0.666] } });
    expectClose(result.expectedShares[0], 1 / 3, { relative: 1e-15 });
    expect(result.warnings.map((warning) => warning.code)).toEqual(['shares-renormalised']);
  });
});

describe('confidence sequences for the shares', () => {
  it.each(reference.intervals.map((row) => [`${row.x} of ${row.n}, Beta(${row.a}, ${row.b}), α = ${row.alpha}`, row] as const))(
    'match mpmath bisection for %s',
    (_name, row) => {
      const interval = shareConfidenceInterval(row.x, row.n, row.a, row.a + row.b, row.alpha);
      const tolerance = { relative: 1e-10, absolute: 1e-300 };
      if (row.lower === 0) expect(interval.lower).toBe(0);
      else expectClose(interval.lower, row.lower, tolerance, 'lower');
      if (row.upper === 1) expect(interval.upper).toBe(1);
      else expectClose(1 - interval.upper, 1 - row.upper, tolerance, '1 − upper');
    },
  );

  it('hold the cumulative share and shrink as a stationary stream grows', () => {
    const batches = Array.from({ length: 12 }, () => [405, 295, 205, 95]);
    const result = analyzeSequential({
      observed: { labels: ['north', 'east', 'south', 'west'] },
      hypothesis: { kind: 'proportions', values: [0.4, 0.3, 0.2, 0.1] },
      batches,
    });
    result.looks.forEach((look, i) => {
      look.shares.forEach((share, j) => {
        expect(share.estimate).toBe(look.counts[j] / look.n);
        expect(share.lower).toBeLessThan(share.estimate);
        expect(share.upper).toBeGreaterThan(share.estimate);
        if (i > 0) {
          const before = result.looks[i - 1].shares[j];
          expect(share.upper - share.lower).toBeLessThan(before.upper - before.lower);
        }
      });
    });
    // With the data on the null, every band still holds its expected share.
    result.looks.at(-1)!.shares.forEach((share) => {
      expect(share.lower).toBeLessThan(share.expected);
      expect(share.upper).toBeGreaterThan(share.expected);
    });
  });

  it('are the whole range before any observation and reach 0 or 1 for an empty or full category', () => {
    expect(shareConfidenceInterval(0, 0, 50, 100, 0.05)).toEqual({ lower: 0, upper: 1 });
    expect(shareConfidenceInterval(0, 50, 25, 100, 0.05).lower).toBe(0);
    expect(shareConfidenceInterval(50, 50, 25, 100, 0.05).upper).toBe(1);
  });
});
