import { analyze } from '@tallyfit/engine';
import { smallPNote, testRows } from './test-rows';

describe('testRows', () => {
  it('shows Pearson’s test with the published figures (McDonald 2014, 1752 vs 1895 under 1:1)', () => {
    // McDonald, Handbook of Biological Statistics, 3rd ed. (2014): X² = 5.61, 1 df, p = 0.0179.
    const result = analyze({ observed: { labels: ['green', 'yellow'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' } });
    const pearson = testRows(result, false).find((row) => row.key === 'pearson');
    expect(pearson).toMatchObject({ statistic: '5.61', df: '1', p: '= .018', main: true });
  });

  it('lists Williams’ correction only when it was asked for', () => {
    const result = analyze({
      observed: { labels: ['a', 'b', 'c'], counts: [10, 20, 30] },
      hypothesis: { kind: 'equal' },
      tests: ['g'],
      williams: true,
    });
    expect(testRows(result, true).map((row) => row.key)).toEqual(['g', 'williams']);
    expect(testRows(result, false).map((row) => row.key)).toEqual(['g']);
    // Williams (1976): q = 1 + (k² − 1) / (6 n df) = 1 + 8 / (6 · 60 · 2) = 1.0111 (arithmetic).
    expect(testRows(result, true)[1].how).toBe('q = 1.0111.');
  });

  it('says how the exact p-value was found', () => {
    const result = analyze({
      observed: { labels: ['a', 'b', 'c', 'd'], counts: [3, 1, 0, 6] },
      hypothesis: { kind: 'equal' },
      tests: ['exact'],
      exact: { method: 'monte-carlo', samples: 2000, seed: 3 },
    });
    const [exact] = testRows(result, false);
    expect(exact.statistic).toBe('—');
    expect(exact.how).toMatch(/^Simulated from 2,000 samples \(seed 3\); Monte Carlo standard error \d/);
  });
});

describe('smallPNote', () => {
  it('writes an underflowed p-value as a power of ten from its logarithm', () => {
    expect(smallPNote(0, -800 * Math.LN10)).toBe('p ≈ 10^-800');
    expect(smallPNote(0.2, Math.log(0.2))).toBe('');
  });
});
