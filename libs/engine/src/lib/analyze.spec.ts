import { analyze } from './analyze';
import { EngineInputError } from './spec/engine-input-error';

describe('analyze', () => {
  it('reproduces a published 1:1 chi-square example', () => {
    // McDonald, Handbook of Biological Statistics, 3rd ed. (2014), chi-square test of goodness-of-fit:
    // 1752 vs 1895 under a 1:1 hypothesis gives X² = 5.61, 1 d.f., P = 0.018.
    const result = analyze({ observed: { labels: ['left', 'right'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' } });
    expect(result.tests.pearson?.statistic).toBeCloseTo(5.6071, 4);
    expect(result.tests.pearson?.p).toBeCloseTo(0.0179, 4);
    expect(result.df).toBe(1);
    expect(result.report.line).toBe('χ²(1, N = 3,647) = 5.61, p = .018');
  });

  it('reproduces a published chi-square and G-test with given proportions', () => {
    // McDonald, Handbook of Biological Statistics, 3rd ed. (2014), chi-square and G-test chapters
    // (foraging observations 70, 79, 3, 4 against 0.54, 0.40, 0.05, 0.01; from memory):
    // X² = 13.59, P = 0.0035; G = 13.145, P = 0.0043.
    const result = analyze({
      observed: { labels: ['a', 'b', 'c', 'd'], counts: [70, 79, 3, 4] },
      hypothesis: { kind: 'proportions', values: [0.54, 0.4, 0.05, 0.01] },
      tests: ['pearson', 'g'],
    });
    expect(result.tests.pearson?.statistic).toBeCloseTo(13.593, 3);
    expect(result.tests.pearson?.p).toBeCloseTo(0.0035, 4);
    expect(result.tests.g?.statistic).toBeCloseTo(13.145, 3);
    expect(result.tests.g?.p).toBeCloseTo(0.0043, 4);
  });

  it('names the field of an invalid input', () => {
    expect(() =>
      analyze({ observed: { labels: ['a', 'b'], counts: [1, -2] }, hypothesis: { kind: 'equal' } }),
    ).toThrow(EngineInputError);
    try {
      analyze({ observed: { labels: ['a', 'b'], counts: [1, 2.5] }, hypothesis: { kind: 'equal' } });
    } catch (error) {
      expect((error as EngineInputError).issues).toEqual([{ path: 'observed.counts.1', message: 'counts must be whole numbers' }]);
    }
  });
});
