import fc from 'fast-check';
import { expectClose } from '../testing/expect-close';
import { analyze } from './analyze';
import { ENGINE_VERSION } from './engine-version';
import { mergeCategories } from './merge/merge-categories';
import { logFactorial } from './special/log-gamma';
import type { AnalysisSpec } from './spec/analysis-spec';
import { EngineInputError, type InputIssue } from './spec/engine-input-error';

function issuesOf(input: unknown): InputIssue[] {
  try {
    analyze(input as AnalysisSpec);
  } catch (error) {
    if (error instanceof EngineInputError) return error.issues;
    throw error;
  }
  throw new Error('expected an EngineInputError');
}

function logMultinomial(counts: readonly number[], shares: readonly number[]): number {
  const n = counts.reduce((a, b) => a + b, 0);
  return counts.reduce((sum, c, i) => sum + (c > 0 ? c * Math.log(shares[i]) : 0) - logFactorial(c), logFactorial(n));
}

/** Exact p of the probability ordering by listing every outcome (small cases only). */
function enumeratedExactP(counts: readonly number[], shares: readonly number[]): number {
  const n = counts.reduce((a, b) => a + b, 0);
  const threshold = logMultinomial(counts, shares) + Math.log1p(1e-7);
  const y = new Array<number>(counts.length).fill(0);
  let total = 0;
  const visit = (index: number, remaining: number) => {
    if (index === counts.length - 1) {
      y[index] = remaining;
      const logP = logMultinomial(y, shares);
      if (logP <= threshold) total += Math.exp(logP);
      return;
    }
    for (let value = 0; value <= remaining; value++) {
      y[index] = value;
      visit(index + 1, remaining - value);
    }
  };
  visit(0, n);
  return Math.min(1, total);
}

const mendel: AnalysisSpec = {
  observed: { labels: ['round yellow', 'round green', 'wrinkled yellow', 'wrinkled green'], counts: [315, 108, 101, 32] },
  hypothesis: { kind: 'ratio', values: [9, 3, 3, 1] },
};

describe('analyze: published examples', () => {
  it('reproduces a published 1:1 chi-square example', () => {
    // McDonald, Handbook of Biological Statistics, 3rd ed. (2014), chi-square test of goodness-of-fit:
    // 1752 vs 1895 under 1:1 gives X² = 5.6071, 1 d.f., P = 0.0179.
    const result = analyze({ observed: { labels: ['left', 'right'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' } });
    expect(result.tests.pearson?.statistic).toBeCloseTo(5.6071, 4);
    expect(result.tests.pearson?.p).toBeCloseTo(0.0179, 4);
    expect(result.df).toBe(1);
    expect(result.report.line).toBe('χ²(1, N = 3,647) = 5.61, p = .018');
  });

  it('reproduces a published chi-square and G-test with given proportions', () => {
    // McDonald (2014), chi-square and G-test chapters (70, 79, 3, 4 against 0.54, 0.40, 0.05, 0.01;
    // from memory): X² = 13.59, P = 0.0035; G = 13.145, P = 0.0043.
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

  it("reproduces Mendel's 9:3:3:1 dihybrid cross (X² = 0.470, 3 d.f., P = 0.925; widely reproduced, from memory)", () => {
    const result = analyze(mendel);
    expect(result.tests.pearson?.statistic).toBeCloseTo(0.47, 3);
    expect(result.tests.pearson?.p).toBeCloseTo(0.925, 3);
    expect(result.tests.g?.statistic).toBeCloseTo(0.475, 3);
    expect(result.expected).toEqual([312.75, 104.25, 104.25, 34.75]);
    expect(result.conclusion.significant).toBe(false);
    expect(result.report.line).toBe('χ²(3, N = 556) = 0.47, p = .925');
  });

  it('uses the two-sided exact binomial test for two categories (McDonald 2014: 8 of 10, P = 0.109)', () => {
    const result = analyze({ observed: { labels: ['right', 'left'], counts: [8, 2] }, hypothesis: { kind: 'equal' }, tests: ['exact', 'pearson'] });
    expect(result.tests.exact?.method).toBe('binomial');
    expect(result.tests.exact?.p).toBeCloseTo(0.109375, 14);
    expect(result.conclusion.test).toBe('exact');
    expect(result.report.line).toBe('exact binomial test, N = 10, p = .109');
  });
});

describe('analyze: choices and options', () => {
  it('runs Pearson and G by default and adds the exact test when Cochran fails', () => {
    const plenty = analyze(mendel);
    expect(Object.keys(plenty.tests)).toEqual(['pearson', 'g']);
    expect(plenty.assumptions.cochranOk).toBe(true);
    expect(plenty.assumptions.advice).toEqual([expect.objectContaining({ code: 'none' })]);

    const sparse = analyze({ observed: { labels: ['a', 'b', 'c', 'd'], counts: [7, 3, 1, 1] }, hypothesis: { kind: 'equal' } });
    expect(Object.keys(sparse.tests)).toEqual(['pearson', 'g', 'exact']);
    expect(sparse.conclusion.test).toBe('exact');
    expect(sparse.assumptions).toMatchObject({ minExpected: 3, shareBelow5: 1, cellsBelow5: 4, cochranOk: false });
    expect(sparse.assumptions.advice[0].code).toBe('use-exact');
    expect(sparse.report.methods).toMatch(/exact multinomial test, because 4 of 4 expected counts were below 5/);
  });

  it('computes exactly the requested tests, including Cressie–Read at λ = 2/3 or a chosen λ', () => {
    const result = analyze({ ...mendel, tests: ['cressie-read', 'pearson'] });
    expect(Object.keys(result.tests)).toEqual(['cressie-read', 'pearson']);
    expect(result.tests['cressie-read']?.lambda).toBeCloseTo(2 / 3, 15);
    expect(result.conclusion.test).toBe('cressie-read');
    const lambdaOne = analyze({ ...mendel, tests: ['cressie-read'], cressieReadLambda: 1 });
    expectClose(lambdaOne.tests['cressie-read']?.statistic ?? NaN, 0.4700239808153477, { relative: 1e-12 });
  });

  it("reports Williams' correction and uses it when asked", () => {
    const plain = analyze({ ...mendel, tests: ['g'] });
    const corrected = analyze({ ...mendel, tests: ['g'], williams: true });
    const q = 1 + 5 / (6 * 556);
    expect(plain.tests.g?.williams.q).toBeCloseTo(q, 15);
    expect(plain.tests.g?.williams.statistic).toBeCloseTo((plain.tests.g?.statistic ?? 0) / q, 14);
    expect(corrected.conclusion.p).toBe(corrected.tests.g?.williams.p);
    expect(corrected.report.line).toMatch(/^G\(3, N = 556\) = 0\.47, p = \.924 \(Williams-corrected, q = 1\.0015\)$/);
  });

  it('honours alpha, posthoc adjustment and interval choices', () => {
    const result = analyze({
      ...mendel,
      alpha: 0.01,
      posthoc: { adjust: 'bonferroni' },
      intervals: { method: 'sison-glaz', level: 0.9 },
    });
    expect(result.conclusion.alpha).toBe(0.01);
    expect(result.posthoc.adjust).toBe('bonferroni');
    expect(result.intervals).toEqual({ method: 'sison-glaz', level: 0.9, simultaneous: true });
    result.categories.forEach((row) => expect(row.pAdjusted).toBeCloseTo(Math.min(1, 4 * row.p), 14));
    expect(result.report.methods).toMatch(/90% Sison–Glaz simultaneous intervals/);
  });

  it('reports per-category residuals and shares', () => {
    const result = analyze({ observed: { labels: ['a', 'b'], counts: [30, 10] }, hypothesis: { kind: 'proportions', values: [0.5, 0.5] } });
    const [a] = result.categories;
    expect(a).toMatchObject({ label: 'a', observed: 30, expected: 20, share: 0.75, expectedShare: 0.5 });
    expect(a.residual).toBeCloseTo(10 / Math.sqrt(20), 14);
    expect(a.adjustedResidual).toBeCloseTo(10 / Math.sqrt(10), 14);
  });

  it('subtracts estimated parameters from the degrees of freedom', () => {
    // Hardy–Weinberg shares from an estimated allele frequency: 3 genotypes, 1 parameter → df = 1.
    const result = analyze({
      observed: { labels: ['AA', 'Aa', 'aa'], counts: [50, 40, 10] },
      hypothesis: { kind: 'proportions', values: [0.49, 0.42, 0.09], estimatedParameters: 1 },
    });
    expect(result.df).toBe(1);
    expect(result.report.methods).toMatch(/1 parameter was estimated from the data/);
    expect(result.report.cautions.join(' ')).toMatch(/Parameters estimated from the same data/);
  });

  it('leaves categories expected to be empty out of the tests, with a warning', () => {
    const result = analyze({
      observed: { labels: ['a', 'b', 'c'], counts: [10, 20, 0] },
      hypothesis: { kind: 'proportions', values: [0.5, 0.5, 0] },
    });
    expect(result.df).toBe(1);
    expect(result.warnings.map((w) => w.code)).toContain('empty-categories-excluded');
    expect(result.categories[2]).toMatchObject({ expected: 0, p: 1, pAdjusted: 1, residual: 0 });
  });

  it('fits a distribution and reports the fit', () => {
    const result = analyze({
      observed: { labels: ['0', '1', '2', '3', '4'], counts: [109, 65, 22, 3, 1] },
      hypothesis: { kind: 'distribution', family: 'poisson' },
    });
    expect(result.df).toBe(3);
    expect(result.hypothesis.fitted?.lambda).toBeCloseTo(0.61, 14);
    expect(result.hypothesis.estimatedNames).toEqual(['lambda']);
    expect(result.assumptions.cochranOk).toBe(false);
    const merge = result.assumptions.advice.find((advice) => advice.code === 'merge-categories');
    // expected 108.7, 66.3, 20.2, 4.1, 0.7: merging 3 and 4 (4.8) still leaves 1 of 4 cells below 5 (25%)
    expect(merge?.plan).toEqual({ groups: [{ label: '2–4', members: ['2', '3', '4'] }] });
  });

  it('applies a proposed merge so that Cochran holds, and says so in the write-up', () => {
    const spec: AnalysisSpec = { observed: { labels: ['a', 'b', 'c', 'd'], counts: [70, 79, 3, 4] }, hypothesis: { kind: 'proportions', values: [0.54, 0.4, 0.05, 0.01] } };
    const before = analyze(spec);
    const plan = before.assumptions.advice.find((advice) => advice.code === 'merge-categories')?.plan;
    expect(plan).toEqual({ groups: [{ label: 'c + d', members: ['c', 'd'] }] });
    const { spec: merged, note } = mergeCategories(spec, plan!);
    expect(merged.observed).toEqual({ labels: ['a', 'b', 'c + d'], counts: [70, 79, 7] });
    expect(note).toBe('Merged before testing: "c", "d" into "c + d".');
    const after = analyze(merged);
    expect(after.assumptions.cochranOk).toBe(true);
    expect(after.report.methods).toContain(note);
    expect(after.report.cautions.join(' ')).toMatch(/Categories were merged/);
  });

  it('reports progress and the engine version', () => {
    const fractions: number[] = [];
    const result = analyze(mendel, { onProgress: (fraction) => fractions.push(fraction) });
    expect(fractions[fractions.length - 1]).toBe(1);
    expect(result.engineVersion).toBe(ENGINE_VERSION);
  });

  it('writes a report with the line, a Markdown table and the cautions', () => {
    const result = analyze({ observed: { labels: ['a|b', 'c'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' } });
    expect(result.report.results).toMatch(/^The observed counts differed from the expected counts, χ²\(1, N = 3,647\) = 5\.61, p = \.018\./);
    expect(result.report.results).toMatch(/w = 0\.04 \(negligible\), 95% CI \[0\.01, 0\.07\]/);
    expect(result.report.table.split('\n')).toHaveLength(4);
    expect(result.report.table).toContain('a\\|b');
    expect(result.report.cautions[0]).toMatch(/small p-value does not mean a large or important difference/);
    expect(result.report.cautions.join(' ')).toMatch(/qualified statistician/);
    expect(result.report.markdown).toContain(result.report.table);
  });
});

describe('analyze: invalid input names the field and the rule', () => {
  const base = { observed: { labels: ['a', 'b'], counts: [1, 2] }, hypothesis: { kind: 'equal' } };

  it.each([
    ['a negative count', { ...base, observed: { labels: ['a', 'b'], counts: [1, -2] } }, 'observed.counts.1', 'counts must not be negative'],
    ['a fractional count', { ...base, observed: { labels: ['a', 'b'], counts: [1, 2.5] } }, 'observed.counts.1', 'counts must be whole numbers'],
    ['NaN', { ...base, observed: { labels: ['a', 'b'], counts: [Number.NaN, 2] } }, 'observed.counts.0', 'each count must be a finite number'],
    ['Infinity', { ...base, observed: { labels: ['a', 'b'], counts: [Infinity, 2] } }, 'observed.counts.0', 'each count must be a finite number'],
    ['mismatched lengths', { ...base, observed: { labels: ['a', 'b'], counts: [1, 2, 3] } }, 'observed.counts', 'observed.counts has 3 entries but observed.labels has 2'],
    ['one category', { ...base, observed: { labels: ['a'], counts: [1] } }, 'observed.labels', 'at least 2 categories are needed, got 1'],
    ['an empty label', { ...base, observed: { labels: ['a', ' '], counts: [1, 2] } }, 'observed.labels.1', 'labels must not be empty'],
    ['a duplicate label', { ...base, observed: { labels: ['a', 'a'], counts: [1, 2] } }, 'observed.labels.1', 'duplicate label "a" (also at position 0)'],
    ['no observations', { ...base, observed: { labels: ['a', 'b'], counts: [0, 0] } }, 'observed.counts', 'all counts are zero: at least one observation is needed'],
    [
      'a zero share with observations',
      { ...base, hypothesis: { kind: 'proportions', values: [1, 0] } },
      'hypothesis.values.1',
      'category "b" is expected to be empty (value 0) but has 2 observations',
    ],
    ['shares that do not sum to 1', { ...base, hypothesis: { kind: 'proportions', values: [0.2, 0.2] } }, 'hypothesis.values', 'proportions must sum to 1; they sum to 0.4'],
    ['too few values', { ...base, hypothesis: { kind: 'ratio', values: [1] } }, 'hypothesis.values', 'hypothesis.values has 1 entries but there are 2 categories'],
    ['an unknown hypothesis kind', { ...base, hypothesis: { kind: 'uniform' } }, 'hypothesis.kind', 'hypothesis.kind must be one of equal, proportions, ratio, counts, distribution'],
    ['an unknown test', { ...base, tests: ['fisher'] }, 'tests.0', 'each test must be one of pearson, g, exact, cressie-read'],
    ['a repeated test', { ...base, tests: ['g', 'g'] }, 'tests.1', 'test "g" is listed twice'],
    ['alpha out of range', { ...base, alpha: 1.5 }, 'alpha', 'alpha must be below 1'],
    [
      'too many estimated parameters',
      { observed: { labels: ['a', 'b', 'c'], counts: [1, 2, 3] }, hypothesis: { kind: 'equal', estimatedParameters: 2 } },
      'hypothesis.estimatedParameters',
      'with 3 categories at most 1 parameters can be estimated (degrees of freedom must stay at least 1)',
    ],
  ])('%s', (_name, input, path, message) => {
    expect(issuesOf(input)).toContainEqual({ path, message });
  });

  it('rejects unknown keys, so a misspelt option is not silently ignored', () => {
    expect(issuesOf({ ...base, test: ['g'] })[0].path).toBe('');
    expect(issuesOf({ ...base, test: ['g'] })[0].message).toMatch(/test/);
  });

  it('accepts zero counts', () => {
    expect(analyze({ observed: { labels: ['a', 'b', 'c'], counts: [0, 5, 9] }, hypothesis: { kind: 'equal' } }).n).toBe(14);
  });
});

const smallSpec = fc
  .integer({ min: 2, max: 5 })
  .chain((k) =>
    fc.record({
      counts: fc.array(fc.integer({ min: 0, max: 7 }), { minLength: k, maxLength: k }).filter((c) => c.some((x) => x > 0)),
      weights: fc.array(fc.integer({ min: 1, max: 9 }), { minLength: k, maxLength: k }),
    }),
  );

function specOf(counts: number[], weights: number[], labels = counts.map((_, i) => `c${i}`)): AnalysisSpec {
  return { observed: { labels, counts }, hypothesis: { kind: 'ratio', values: weights }, tests: ['pearson', 'g', 'cressie-read', 'exact'], exact: { method: 'enumerate' } };
}

describe('analyze: properties', () => {
  it('gives p in [0, 1], never NaN, and plain JSON', () => {
    fc.assert(
      fc.property(smallSpec, ({ counts, weights }) => {
        const result = analyze(specOf(counts, weights));
        for (const test of Object.values(result.tests)) {
          expect(test.p).toBeGreaterThanOrEqual(0);
          expect(test.p).toBeLessThanOrEqual(1);
          expect(Number.isFinite(test.logP)).toBe(true);
        }
        expect(JSON.parse(JSON.stringify(result))).toEqual(result);
        expect(JSON.stringify(result)).not.toMatch(/NaN|null/);
      }),
      { numRuns: 150 },
    );
  });

  it('exact p equals full enumeration and is at least the observed outcome’s probability', () => {
    fc.assert(
      fc.property(smallSpec, ({ counts, weights }) => {
        const total = weights.reduce((a, b) => a + b, 0);
        const shares = weights.map((w) => w / total);
        const result = analyze({ ...specOf(counts, weights), tests: ['exact'], exact: { method: 'enumerate', ordering: 'probability' } });
        const exact = result.tests.exact!;
        expectClose(exact.p, enumeratedExactP(counts, shares), { relative: 1e-9, absolute: 1e-15 });
        expect(exact.p).toBeGreaterThanOrEqual(Math.exp(logMultinomial(counts, shares)) * (1 - 1e-9));
      }),
      { numRuns: 60 },
    );
  });

  it('does not depend on the order or the names of the categories', () => {
    fc.assert(
      fc.property(smallSpec, fc.nat(), ({ counts, weights }, seed) => {
        const order = counts.map((_, i) => i).sort((a, b) => ((a * 7919 + seed) % 13) - ((b * 7919 + seed) % 13));
        const original = analyze(specOf(counts, weights));
        const permuted = analyze(
          specOf(
            order.map((i) => counts[i]),
            order.map((i) => weights[i]),
            order.map((i) => `renamed ${i}`),
          ),
        );
        for (const key of ['pearson', 'g', 'cressie-read', 'exact'] as const) {
          expectClose(permuted.tests[key]!.p, original.tests[key]!.p, { relative: 1e-9, absolute: 1e-15 }, key);
        }
        order.forEach((from, to) => {
          expectClose(permuted.categories[to].pAdjusted, original.categories[from].pAdjusted, { relative: 1e-12, absolute: 1e-15 });
          expectClose(permuted.categories[to].interval.low, original.categories[from].interval.low, { absolute: 1e-15 });
        });
      }),
      { numRuns: 100 },
    );
  });
});

describe('analyze: never NaN across hypothesis kinds and options (property)', () => {
  const options = fc.record({
    tests: fc.constantFrom<AnalysisSpec['tests']>(['pearson', 'g', 'cressie-read'], ['g'], ['cressie-read', 'pearson']),
    cressieReadLambda: fc.double({ min: -0.9, max: 3, noNaN: true }),
    intervals: fc.record({
      method: fc.constantFrom('wilson' as const, 'goodman' as const, 'quesenberry-hurst' as const, 'sison-glaz' as const),
      level: fc.double({ min: 0.5, max: 0.999, noNaN: true }),
    }),
    posthoc: fc.record({ adjust: fc.constantFrom('holm' as const, 'bonferroni' as const, 'none' as const) }),
    williams: fc.boolean(),
  });
  const countsArbitrary = fc
    .array(fc.oneof(fc.integer({ min: 0, max: 20 }), fc.integer({ min: 0, max: 100_000 })), { minLength: 2, maxLength: 12 })
    .filter((counts) => counts.some((c) => c > 0));

  function check(spec: AnalysisSpec): void {
    const result = analyze(spec);
    const text = JSON.stringify(result);
    expect(text).not.toMatch(/NaN|null|Infinity/);
    expect(JSON.parse(text)).toEqual(result);
    for (const test of Object.values(result.tests)) {
      expect(test.p).toBeGreaterThanOrEqual(0);
      expect(test.p).toBeLessThanOrEqual(1);
    }
    for (const row of result.categories) {
      expect(row.interval.low).toBeGreaterThanOrEqual(0);
      expect(row.interval.high).toBeLessThanOrEqual(1);
      expect(row.interval.low).toBeLessThanOrEqual(row.interval.high);
    }
  }

  it('for given shares and ratios', () => {
    fc.assert(
      fc.property(countsArbitrary, options, fc.array(fc.integer({ min: 1, max: 50 }), { minLength: 12, maxLength: 12 }), (counts, extra, weights) => {
        check({ observed: { labels: counts.map((_, i) => `g${i}`), counts }, hypothesis: { kind: 'ratio', values: weights.slice(0, counts.length) }, ...extra });
      }),
      { numRuns: 60 },
    );
  });

  it('for fitted families', () => {
    fc.assert(
      fc.property(
        countsArbitrary,
        options,
        fc.constantFrom('poisson' as const, 'geometric' as const, 'binomial' as const, 'discrete-uniform' as const),
        (counts, extra, family) => {
          const nonZeroValues = counts.some((c, i) => c > 0 && i > 0);
          // a fitted family with one estimated parameter needs at least 3 categories
          fc.pre(nonZeroValues && counts.filter((c) => c > 0).length >= 2 && counts.length >= 3);
          const labels = counts.map((_, i) => String(i));
          const params = family === 'binomial' ? { trials: counts.length - 1 + 3 } : undefined;
          check({ observed: { labels, counts }, hypothesis: { kind: 'distribution', family, ...(params ? { params } : {}) }, ...extra });
        },
      ),
      { numRuns: 60 },
    );
  });
});
