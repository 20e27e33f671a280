import { analyze } from '../analyze';
import { EngineInputError } from '../spec/engine-input-error';
import { mergeCategories } from './merge-categories';

describe('mergeCategories', () => {
  it('sums ratio terms, keeping the hypothesis exact', () => {
    const { spec } = mergeCategories(
      { observed: { labels: ['AA', 'Aa', 'aa'], counts: [25, 50, 25] }, hypothesis: { kind: 'ratio', values: [1, 2, 1] } },
      { groups: [{ label: 'A_', members: ['AA', 'Aa'] }] },
    );
    expect(spec.observed).toEqual({ labels: ['A_', 'aa'], counts: [75, 25] });
    expect(spec.hypothesis).toEqual({ kind: 'ratio', values: [3, 1] });
  });

  it('turns equal shares into a ratio of group sizes', () => {
    const { spec } = mergeCategories(
      { observed: { labels: ['a', 'b', 'c', 'd'], counts: [5, 1, 1, 5] }, hypothesis: { kind: 'equal' } },
      { groups: [{ label: 'b or c', members: ['c', 'b'] }] },
    );
    expect(spec.observed).toEqual({ labels: ['a', 'b or c', 'd'], counts: [5, 2, 5] });
    expect(spec.hypothesis).toEqual({ kind: 'ratio', values: [1, 2, 1] });
    expect(spec.mergedCategories).toEqual([{ label: 'b or c', members: ['b', 'c'] }]);
  });

  it('keeps a fitted distribution as its shares and its estimated parameters', () => {
    const { spec, note } = mergeCategories(
      { observed: { labels: ['0', '1', '2', '3', '4'], counts: [109, 65, 22, 3, 1] }, hypothesis: { kind: 'distribution', family: 'poisson' } },
      { groups: [{ label: '2+', members: ['2', '3', '4'] }] },
    );
    expect(spec.hypothesis.kind).toBe('proportions');
    expect(spec.hypothesis).toMatchObject({ estimatedParameters: 1 });
    expect(note).toMatch(/fitted before merging/);
    const result = analyze(spec);
    expect(result.df).toBe(1);
    expect(result.report.methods).toContain(note);
  });

  it('names what is wrong with a plan', () => {
    const spec = { observed: { labels: ['a', 'b', 'c'], counts: [1, 2, 3] }, hypothesis: { kind: 'equal' as const } };
    expect(() => mergeCategories(spec, { groups: [{ label: 'x', members: ['a', 'z'] }] })).toThrow(
      new EngineInputError([{ path: 'plan.groups.0.members.1', message: 'there is no category "z"' }]),
    );
    expect(() => mergeCategories(spec, { groups: [{ label: 'x', members: ['a', 'b', 'c'] }] })).toThrow(/at least 2 categories/);
    expect(() => mergeCategories(spec, { groups: [{ label: 'c', members: ['a', 'b'] }] })).toThrow(/clashes/);
    expect(() =>
      mergeCategories(spec, {
        groups: [
          { label: 'x', members: ['a', 'b'] },
          { label: 'y', members: ['b', 'c'] },
        ],
      }),
    ).toThrow(/already in another group/);
  });
});
