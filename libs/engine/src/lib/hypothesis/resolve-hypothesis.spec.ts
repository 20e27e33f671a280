import { expectClose } from '../../testing/expect-close';
import { readFixture } from '../../testing/reference-fixtures';
import { jStat } from '../../testing/reference-libraries';
import type { AnalysisSpec } from '../spec/analysis-spec';
import { EngineInputError } from '../spec/engine-input-error';
import { parseAnalysisSpec } from '../spec/parse-analysis-spec';
import { resolveHypothesis } from './resolve-hypothesis';

function resolve(spec: AnalysisSpec) {
  return resolveHypothesis(parseAnalysisSpec(spec));
}

function issuesOf(action: () => unknown): { path: string; message: string }[] {
  try {
    action();
  } catch (error) {
    if (error instanceof EngineInputError) return error.issues;
    throw error;
  }
  throw new Error('expected an EngineInputError');
}

describe('ratio and given shares', () => {
  it('turns 9:3:3:1 into exact sixteenths and 1:1:1 into the nearest doubles to 1/3', () => {
    const mendel = resolve({ observed: { labels: ['a', 'b', 'c', 'd'], counts: [315, 108, 101, 32] }, hypothesis: { kind: 'ratio', values: [9, 3, 3, 1] } });
    expect(mendel.shares).toEqual([0.5625, 0.1875, 0.1875, 0.0625]);
    expect(mendel.description).toBe('the expected ratio 9:3:3:1');
    const thirds = resolve({ observed: { labels: ['a', 'b', 'c'], counts: [1, 1, 1] }, hypothesis: { kind: 'ratio', values: [1, 1, 1] } });
    expect(thirds.shares).toEqual([1 / 3, 1 / 3, 1 / 3]);
  });

  it('uses proportions summing to 1 within 1e-6 without a warning, and renormalises rounded ones with one', () => {
    const exact = resolve({ observed: { labels: ['a', 'b'], counts: [1, 1] }, hypothesis: { kind: 'proportions', values: [0.3, 0.7000001] } });
    expect(exact.warnings).toEqual([]);
    const rounded = resolve({ observed: { labels: ['a', 'b', 'c'], counts: [1, 1, 1] }, hypothesis: { kind: 'proportions', values: [0.333, 0.333, 0.333] } });
    expect(rounded.warnings.map((w) => w.code)).toEqual(['shares-renormalised']);
    expect(rounded.shares.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 15);
  });

  it('rejects shares that miss 1 by more than a rounding amount, naming the field', () => {
    expect(issuesOf(() => resolve({ observed: { labels: ['a', 'b'], counts: [1, 1] }, hypothesis: { kind: 'proportions', values: [0.5, 0.6] } }))).toEqual([
      { path: 'hypothesis.values', message: 'proportions must sum to 1; they sum to 1.1' },
    ]);
  });

  it('rescales expected counts that differ from n by rounding, and rejects others', () => {
    const rescaled = resolve({ observed: { labels: ['a', 'b'], counts: [50, 50] }, hypothesis: { kind: 'counts', values: [50.2, 50.1] } });
    expect(rescaled.warnings.map((w) => w.code)).toEqual(['expected-counts-rescaled']);
    expect(issuesOf(() => resolve({ observed: { labels: ['a', 'b'], counts: [50, 50] }, hypothesis: { kind: 'counts', values: [10, 20] } }))[0].path).toBe(
      'hypothesis.values',
    );
  });
});

describe('fitted distributions', () => {
  it('reproduces the Poisson fit of the horse-kick data (Bortkiewicz 1898; expected 108.7, 66.3, 20.2, 4.1, from memory)', () => {
    const fit = resolve({
      observed: { labels: ['0', '1', '2', '3', '4'], counts: [109, 65, 22, 3, 1] },
      hypothesis: { kind: 'distribution', family: 'poisson' },
    });
    expect(fit.fitted?.lambda).toBeCloseTo(0.61, 12);
    expect(fit.estimatedParameters).toBe(1);
    const expected = fit.shares.map((share) => share * 200);
    [108.7, 66.3, 20.2, 4.1].forEach((value, i) => expect(expected[i]).toBeCloseTo(value, 1));
    // the last cell holds the whole upper tail P(X >= 4), checked against jstat's Poisson cdf
    expectClose(fit.shares[4], 1 - jStat.poisson.cdf(3, 0.61), { relative: 1e-12 });
    expect(fit.notes.join(' ')).toMatch(/larger values/);
  });

  it('pools the upper tail into one cell with cells: m', () => {
    const fit = resolve({
      observed: { labels: ['0', '1', '2', '3', '4'], counts: [109, 65, 22, 3, 1] },
      hypothesis: { kind: 'distribution', family: 'poisson', params: { lambda: 0.61 }, cells: 4 },
    });
    expect(fit.cells).toEqual({ labels: ['0', '1', '2', '3+'], counts: [109, 65, 22, 4] });
    expect(fit.estimatedParameters).toBe(0);
    expectClose(fit.shares[3], 1 - jStat.poisson.cdf(2, 0.61), { relative: 1e-12 });
  });

  it('fits a binomial with given trials by p̂ = mean / trials, with shares from jstat', () => {
    const counts = [3, 24, 104, 286, 670, 1033, 1343, 1112, 829, 478, 181, 45, 7];
    const labels = counts.map((_, i) => String(i));
    const fit = resolve({ observed: { labels, counts }, hypothesis: { kind: 'distribution', family: 'binomial', params: { trials: 12 } } });
    const n = counts.reduce((a, b) => a + b, 0);
    const mean = counts.reduce((sum, c, i) => sum + c * i, 0) / n;
    expectClose(fit.fitted?.p ?? 0, mean / 12, { relative: 1e-15 });
    fit.shares.forEach((share, i) => expectClose(share, jStat.binomial.pdf(i, 12, mean / 12), { relative: 1e-9 }, `value ${i}`));
  });

  it('fits a geometric law (failures before the first success) by p̂ = 1 / (1 + mean)', () => {
    const fit = resolve({ observed: { labels: ['0', '1', '2', '3'], counts: [40, 25, 20, 15] }, hypothesis: { kind: 'distribution', family: 'geometric' } });
    const p = 1 / (1 + (25 + 40 + 45) / 100);
    expectClose(fit.fitted?.p ?? 0, p, { relative: 1e-15 });
    expectClose(fit.shares[1], p * (1 - p), { relative: 1e-14 });
    expectClose(fit.shares[3], (1 - p) ** 3, { relative: 1e-14 });
  });

  it("gives Benford's first-digit shares log10(1 + 1/d) (Benford 1938)", () => {
    const labels = ['1', '2', '3', '4', '5', '6', '7', '8', '9'];
    const fit = resolve({ observed: { labels, counts: labels.map(() => 10) }, hypothesis: { kind: 'distribution', family: 'benford' } });
    expect(fit.shares[0]).toBeCloseTo(0.30103, 5);
    expect(fit.shares[8]).toBeCloseTo(0.04576, 5);
    expect(fit.shares.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 14);
    expect(fit.estimatedParameters).toBe(0);
  });

  it('gives equal chances to a discrete uniform range, sorting labels by value', () => {
    const fit = resolve({ observed: { labels: ['3', '1', '2'], counts: [5, 6, 7] }, hypothesis: { kind: 'distribution', family: 'discrete-uniform' } });
    expect(fit.cells).toEqual({ labels: ['1', '2', '3'], counts: [6, 7, 5] });
    expect(fit.shares).toEqual([1 / 3, 1 / 3, 1 / 3]);
  });

  it('fits a binned normal by maximum likelihood over the bins, where SciPy finds the maximum', () => {
    // SciPy's optimiser on Σ nᵢ ln P(bin i) and the shares at its optimum in mpmath (tools/fixtures/engine-reference.py).
    // Both optimisers stop when the log-likelihood is flat to about 1e-12, which leaves the parameters uncertain to
    // about 1e-7 standard deviations (measured: 2e-8).
    for (const row of readFixture('binned-normal').cases) {
      const fit = resolve({
        observed: { labels: row.counts.map((_, i) => `bin ${i}`), counts: row.counts },
        hypothesis: { kind: 'distribution', family: 'normal', breaks: row.breaks },
      });
      const at = `counts ${row.counts}`;
      expect(fit.estimatedParameters).toBe(2);
      const { mean, sd } = fit.fitted as { mean: number; sd: number };
      expectClose(mean, row.mean, { absolute: 1e-7 * row.sd }, `mean, ${at}`);
      expectClose(sd, row.sd, { relative: 1e-7 }, `sd, ${at}`);
      fit.shares.forEach((share, i) => expectClose(share, row.shares[i], { relative: 1e-6 }, `share ${i}, ${at}`));
    }
  });

  it('names what is wrong with a distribution spec', () => {
    const labels = ['0', '1', '3'];
    expect(issuesOf(() => resolve({ observed: { labels, counts: [1, 2, 3] }, hypothesis: { kind: 'distribution', family: 'poisson' } }))[0]).toEqual({
      path: 'observed.labels',
      message: 'the values must be an unbroken run of whole numbers: 2 is missing (add it with count 0)',
    });
    expect(
      issuesOf(() => resolve({ observed: { labels: ['0', 'x'], counts: [1, 2] }, hypothesis: { kind: 'distribution', family: 'poisson' } }))[0].path,
    ).toBe('observed.labels.1');
    expect(
      issuesOf(() => resolve({ observed: { labels: ['0', '1'], counts: [1, 2] }, hypothesis: { kind: 'distribution', family: 'binomial' } }))[0].path,
    ).toBe('hypothesis.params.trials');
    expect(
      issuesOf(() =>
        resolve({ observed: { labels: ['4', '5'], counts: [1, 2] }, hypothesis: { kind: 'distribution', family: 'binomial', params: { trials: 4 } } }),
      )[0],
    ).toEqual({ path: 'observed.labels.1', message: 'the value 5 is outside what binomial can produce (0 to 4)' });
    expect(
      issuesOf(() => resolve({ observed: { labels: ['0', '1'], counts: [5, 0] }, hypothesis: { kind: 'distribution', family: 'poisson' } }))[0].path,
    ).toBe('hypothesis.params.lambda');
    expect(
      issuesOf(() =>
        resolve({ observed: { labels: ['0', '1'], counts: [5, 1] }, hypothesis: { kind: 'distribution', family: 'poisson', params: { p: 0.5 } } }),
      )[0].path,
    ).toBe('hypothesis.params.p');
    expect(
      issuesOf(() => resolve({ observed: { labels: ['a', 'b', 'c'], counts: [5, 1, 2] }, hypothesis: { kind: 'distribution', family: 'normal', breaks: [0] } }))[0]
        .path,
    ).toBe('hypothesis.breaks');
  });
});
