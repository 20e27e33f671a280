/** The README's examples, run against the public entry point so the documentation cannot drift. */
import {
  analyze,
  chiSquareCriticalValue,
  chiSquareLogSurvival,
  chiSquareQuantile,
  chiSquareSurvival,
  EngineInputError,
  mergeCategories,
  power,
  sampleSize,
  type AnalysisSpec,
} from './index';

describe('README examples', () => {
  it('quick start', () => {
    const result = analyze({ observed: { labels: ['control', 'variant'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' } });
    expect(result.report.line).toBe('χ²(1, N = 3,647) = 5.61, p = .018');
    expect(result.conclusion.verdict).toBe('The observed counts differ from what was expected (p = .018, below α = 0.05).');
  });

  it('invalid input', () => {
    expect(() => analyze({ observed: { labels: ['a', 'b'], counts: [3, 2.5] }, hypothesis: { kind: 'equal' } })).toThrow(
      new EngineInputError([{ path: 'observed.counts.1', message: 'counts must be whole numbers' }]),
    );
  });

  it('exact test for sparse counts, and two categories', () => {
    const sparse = analyze({ observed: { labels: ['scratch', 'dent', 'crack', 'stain'], counts: [7, 3, 1, 1] }, hypothesis: { kind: 'equal' } });
    expect(sparse.assumptions.cochranOk).toBe(false);
    expect(Object.keys(sparse.tests)).toEqual(['pearson', 'g', 'exact']);
    expect(sparse.conclusion.test).toBe('exact');
    const two = analyze({ observed: { labels: ['right', 'left'], counts: [8, 2] }, hypothesis: { kind: 'equal' }, tests: ['exact'] });
    expect(two.tests.exact).toMatchObject({ ordering: 'probability', method: 'binomial' });
    expect(two.tests.exact?.p).toBeCloseTo(0.109375, 14);
  });

  it('merging sparse categories', () => {
    const spec: AnalysisSpec = {
      observed: { labels: ['oak', 'pine', 'birch', 'larch'], counts: [70, 79, 3, 4] },
      hypothesis: { kind: 'proportions', values: [0.54, 0.4, 0.05, 0.01] },
    };
    const plan = analyze(spec).assumptions.advice.find((item) => item.code === 'merge-categories')?.plan;
    expect(plan).toEqual({ groups: [{ label: 'birch + larch', members: ['birch', 'larch'] }] });
    const { spec: merged, note } = mergeCategories(spec, plan!);
    expect(note).toBe('Merged before testing: "birch", "larch" into "birch + larch".');
    expect(analyze(merged).report.methods).toContain(note);
  });

  it('effect size, categories and intervals', () => {
    const result = analyze({
      observed: { labels: ['a', 'b', 'c', 'd'], counts: [70, 79, 3, 4] },
      hypothesis: { kind: 'proportions', values: [0.54, 0.4, 0.05, 0.01] },
      posthoc: { adjust: 'holm' },
      intervals: { method: 'sison-glaz', level: 0.95 },
    });
    expect(result.effectSize.w).toBeCloseTo(0.295, 3);
    expect(result.effectSize.size).toBe('small');
    expect(result.effectSize.interval?.low).toBeCloseTo(0.1, 2);
    expect(result.effectSize.interval?.high).toBeCloseTo(0.43, 2);
    expect(result.categories[1].expected).toBeCloseTo(62.4, 10);
    expect(result.categories[1].residual).toBeCloseTo(2.1, 2);
    expect(result.categories[1].pAdjusted).toBeCloseTo(0.035, 3);
  });

  it('planning and distribution functions', () => {
    expect(power({ w: 0.3, df: 1, n: 100 }).power).toBeCloseTo(0.8508, 4);
    expect(sampleSize({ w: 0.1, df: 1, power: 0.8 })).toMatchObject({ n: 785 });
    expect(sampleSize({ w: 0.1, df: 1, power: 0.8 }).nContinuous).toBeCloseTo(784.886, 3);
    expect(chiSquareSurvival(5.6071, 1)).toBeCloseTo(0.0178878, 7);
    expect(chiSquareLogSurvival(1500, 1)).toBeCloseTo(-753.883067105382, 9);
    expect(chiSquareCriticalValue(0.05, 3)).toBeCloseTo(7.8147, 4);
    expect(chiSquareQuantile(0.5, 10)).toBeCloseTo(9.3418, 4);
  });
});
