import type { AnalysisSpec } from '@tallyfit/engine';
import { engineLane } from './engine-job-size';

// Invented counts; the lane only depends on which tests run and how much the exact test may do.
const three = { labels: ['a', 'b', 'c'], counts: [40, 35, 25] };

describe('engineLane', () => {
  const lane = (spec: object) => engineLane(spec as AnalysisSpec);

  it('puts chi-square-only runs in the small lane', () => {
    expect(lane({ observed: three, hypothesis: { kind: 'equal' }, tests: ['pearson', 'g'] })).toBe('small');
  });

  it('puts runs with no tests listed in the small lane when every expected count is at least 5 (the exact test will not run)', () => {
    expect(lane({ observed: three, hypothesis: { kind: 'proportions', values: [0.5, 0.3, 0.2] } })).toBe('small');
  });

  it('puts a requested exact test in the large lane unless its work is tiny', () => {
    const many = { labels: ['a', 'b', 'c', 'd', 'e', 'f'], counts: [310, 295, 330, 280, 305, 320] };
    expect(lane({ observed: many, hypothesis: { kind: 'equal' }, tests: ['exact'] })).toBe('large');
    // C(100 + 2, 2) = 5151 outcome vectors: enumerated in milliseconds.
    expect(lane({ observed: three, hypothesis: { kind: 'equal' }, tests: ['exact'] })).toBe('small');
    // Two categories: the binomial test.
    expect(lane({ observed: { labels: ['a', 'b'], counts: [900, 1000] }, hypothesis: { kind: 'equal' }, tests: ['exact'] })).toBe('small');
  });

  it('puts Monte Carlo runs with more than the default draws in the large lane', () => {
    const spec = { observed: three, hypothesis: { kind: 'equal' }, tests: ['exact'], exact: { method: 'monte-carlo', samples: 200_000 } };
    expect(lane(spec)).toBe('large');
    expect(lane({ ...spec, exact: { method: 'monte-carlo', samples: 50_000 } })).toBe('small');
  });

  it('counts a run with no tests listed and small expected counts as an exact run', () => {
    const sparse = { labels: Array.from({ length: 12 }, (_, i) => `c${i}`), counts: Array.from({ length: 12 }, () => 30) };
    expect(lane({ observed: sparse, hypothesis: { kind: 'equal' } })).toBe('small');
    expect(lane({ observed: { ...sparse, counts: sparse.counts.map(() => 4) }, hypothesis: { kind: 'equal' } })).toBe('large');
  });

  it('puts runs over many categories in the large lane', () => {
    const wide = { labels: Array.from({ length: 60 }, (_, i) => `c${i}`), counts: Array.from({ length: 60 }, () => 100) };
    expect(lane({ observed: wide, hypothesis: { kind: 'equal' }, tests: ['pearson'] })).toBe('large');
  });
});
