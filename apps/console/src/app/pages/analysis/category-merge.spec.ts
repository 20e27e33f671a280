import { analyze, analysisSpecSchema, type AnalysisSpec } from '@tallyfit/engine';
import { mergedRun, withExactTest } from './category-merge';

describe('mergedRun', () => {
  const spec: AnalysisSpec = {
    observed: { labels: ['none', 'one', 'two', 'three', 'four'], counts: [40, 30, 20, 3, 1] },
    hypothesis: { kind: 'ratio', values: [8, 6, 4, 1, 1] },
  };
  const result = analyze(spec);

  it('sums the counts and the ratio terms of each merged group', () => {
    const { spec: merged, lines } = mergedRun(spec, { groups: [{ label: 'three or more', members: ['three', 'four'] }] });
    expect(merged.observed).toEqual({ labels: ['none', 'one', 'two', 'three or more'], counts: [40, 30, 20, 4] });
    // 8:6:4:1:1 with the last two merged is 8:6:4:2 (arithmetic).
    expect(merged.hypothesis).toEqual({ kind: 'ratio', values: [8, 6, 4, 2] });
    expect(lines).toEqual(['“three”, “four” → “three or more”']);
    expect(merged.mergedCategories).toEqual([{ label: 'three or more', members: ['three', 'four'] }]);
    expect(merged.notes?.[0]).toContain('"three", "four" into "three or more"');
  });

  it('gives a spec the engine accepts, with one degree of freedom fewer', () => {
    const { spec: merged } = mergedRun(spec, { groups: [{ label: 'three or more', members: ['three', 'four'] }] });
    expect(analysisSpecSchema.safeParse(merged).success).toBe(true);
    expect(analyze(merged).df).toBe(result.df - 1);
  });

  it('keeps a fitted family’s estimated parameters counted against the degrees of freedom', () => {
    const fitted: AnalysisSpec = {
      observed: { labels: ['0', '1', '2', '3', '4'], counts: [30, 35, 20, 8, 2] },
      hypothesis: { kind: 'distribution', family: 'poisson' },
    };
    const fittedResult = analyze(fitted);
    const last = fittedResult.categories.slice(-2).map((row) => row.label);
    const { spec: merged } = mergedRun(fitted, { groups: [{ label: 'tail', members: last }] });
    expect(merged.hypothesis).toMatchObject({ kind: 'proportions', estimatedParameters: 1 });
    expect(analyze(merged).df).toBe(fittedResult.df - 1);
  });

  it('refuses a plan that names a category the data does not have', () => {
    expect(() => mergedRun(spec, { groups: [{ label: 'x', members: ['three', 'five'] }] })).toThrow('there is no category "five"');
  });
});

describe('withExactTest', () => {
  it('adds the exact test to the default tests, once', () => {
    const spec: AnalysisSpec = { observed: { labels: ['a', 'b'], counts: [1, 2] }, hypothesis: { kind: 'equal' } };
    expect(withExactTest(spec).tests).toEqual(['pearson', 'g', 'exact']);
    expect(withExactTest({ ...spec, tests: ['exact'] }).tests).toEqual(['exact']);
  });
});
