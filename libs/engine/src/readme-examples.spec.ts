/**
 * The README's examples, run against the public entry point so the documentation cannot drift. Every number the
 * README shows is checked against a value computed outside the engine (fixtures from tools/fixtures/engine-reference.py),
 * and the engine is checked against the same value.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { expectClose } from './testing/expect-close';
import { readFixture, rowWhere } from './testing/reference-fixtures';
import {
  addSequentialBatch,
  analyze,
  analyzeSegments,
  analyzeSequential,
  chiSquareCriticalValue,
  chiSquareLogSurvival,
  chiSquareQuantile,
  chiSquareSurvival,
  EngineInputError,
  mergeCategories,
  power,
  sampleSize,
  startSequential,
  type AnalysisSpec,
} from './index';

const readme = readFileSync(join(__dirname, '..', 'README.md'), 'utf8');

/** The README shows `shown` (digits cut short with "…", or a whole number) and the reference value begins with those digits. */
function documented(shown: string, reference: number): void {
  expect(readme).toContain(shown);
  const number = /([−-]?[\d.]+)(…?)$/.exec(shown);
  if (!number) throw new Error(`no number at the end of "${shown}"`);
  const digits = number[1].replace('−', '-');
  const agrees = number[2] ? String(reference).startsWith(digits) : reference === Number(digits);
  if (!agrees) throw new Error(`the README shows "${shown}" but the reference value is ${reference}`);
}

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

  it('segments', () => {
    const split = analyzeSegments({
      spec: { hypothesis: { kind: 'equal' } },
      labels: ['control', 'variant'],
      segments: [
        { segment: 'desktop', counts: [1752, 1895] },
        { segment: 'tablet', counts: [500, 500] },
        { segment: 'watch', counts: [3, 1] },
      ],
      segmentName: 'device',
    });
    // McDonald, Handbook of Biological Statistics, 3rd ed. (2014): 1752 vs 1895 under 1:1, p = 0.0179; Holm with m = 3 triples the smallest p.
    expect(split.rows[0]).toMatchObject({ segment: 'desktop', rank: 1, test: 'pearson', significant: false });
    expect(split.rows[0].p).toBeCloseTo(0.0179, 4);
    expect(split.rows[0].pAdjusted).toBeCloseTo(3 * 0.017887, 5);
    expect(split.rows.find((row) => row.segment === 'watch')!.flag?.code).toBe('too-small');
    expect(split.report.paragraph).toMatch(/^The same test was run in each of 3 segments by device, and the 3 p-values were adjusted with Holm's/);
  });

  it('effect size, categories and intervals', () => {
    const result = analyze({
      observed: { labels: ['a', 'b', 'c', 'd'], counts: [70, 79, 3, 4] },
      hypothesis: { kind: 'proportions', values: [0.54, 0.4, 0.05, 0.01] },
      posthoc: { adjust: 'holm' },
      intervals: { method: 'sison-glaz', level: 0.95 },
    });
    const reference = rowWhere(readFixture('analyses').cases, { name: 'proportions' });
    documented('w: 0.295…', reference.w);
    documented('low: 0.10…', reference.wInterval.low);
    documented('high: 0.43…', reference.wInterval.high);
    expectClose(result.effectSize.w, reference.w, { relative: 1e-14 });
    expect(result.effectSize.size).toBe('small');
    expectClose(result.effectSize.interval!.low, reference.wInterval.low, { relative: 1e-9 });
    expectClose(result.effectSize.interval!.high, reference.wInterval.high, { relative: 1e-9 });
    const [b, referenceB] = [result.categories[1], reference.categories[1]];
    documented('expected: 62.4', Number(referenceB.expected.toPrecision(14)));
    documented('residual: 2.10…', referenceB.residual);
    documented('pAdjusted: 0.0347…', referenceB.pHolm);
    expectClose(b.expected, referenceB.expected, { relative: 1e-15 });
    expectClose(b.residual, referenceB.residual, { relative: 1e-14 });
    expectClose(b.pAdjusted, referenceB.pHolm, { relative: 1e-13 });
  });

  it('planning and distribution functions', () => {
    const planned = rowWhere(readFixture('power').power, { w: 0.3, df: 1, n: 100, alpha: 0.05 });
    documented('power: 0.8508…', planned.power);
    documented('criticalValue: 3.8414…', planned.criticalValue);
    expectClose(power({ w: 0.3, df: 1, n: 100 }).power, planned.power, { relative: 1e-13 });
    const sized = rowWhere(readFixture('power').sampleSize, { w: 0.1, df: 1, power: 0.8, alpha: 0.05 });
    documented('n: 785', sized.n);
    documented('nContinuous: 784.886…', sized.nContinuous);
    documented('power: 0.8000…', sized.powerAtN);
    expect(sampleSize({ w: 0.1, df: 1, power: 0.8 })).toMatchObject({ n: sized.n });
    expectClose(sampleSize({ w: 0.1, df: 1, power: 0.8 }).nContinuous, sized.nContinuous, { relative: 1e-12 });

    const chiSquare = readFixture('chi-square');
    const survival = rowWhere(chiSquare.tails, { x: 5.6071, df: 1 });
    documented('5.6071, 1); // 0.0178878…', survival.upper);
    expectClose(chiSquareSurvival(5.6071, 1), survival.upper, { relative: 1e-13 });
    const farTail = rowWhere(chiSquare.tails, { x: 1500, df: 1 });
    documented('// −753.883067105382…', farTail.logUpper);
    expectClose(chiSquareLogSurvival(1500, 1), farTail.logUpper, { relative: 4 * Number.EPSILON });
    const critical = rowWhere(chiSquare.quantiles, { df: 3, alpha: 0.05 });
    documented('// 7.8147…', critical.criticalValue);
    expectClose(chiSquareCriticalValue(0.05, 3), critical.criticalValue, { relative: 1e-14 });
    const median = rowWhere(chiSquare.quantiles, { df: 10, alpha: 0.5 });
    documented('// 9.3418…', median.lowerQuantile!);
    expectClose(chiSquareQuantile(0.5, 10), median.lowerQuantile!, { relative: 1e-14 });
  });

  it('sequential tests for streams of batches', () => {
    const result = analyzeSequential({
      observed: { labels: ['control', 'variant'] },
      hypothesis: { kind: 'equal' },
      batches: [[5030, 4970], [5120, 4880], [5150, 4850], [5100, 4900]],
    });
    const p = result.looks.map((look) => look.p);
    expect(p.slice(0, 2)).toEqual([1, 1]);
    expect(p[2]).toBeCloseTo(0.04395, 5);
    expect(p[3]).toBeCloseTo(0.006865, 6);
    expect(result.firstAlarm).toBe(3);
    expect(result.looks[2].n).toBe(30000);
    const control = result.looks[3].shares[0];
    expect(control).toMatchObject({ label: 'control', expected: 0.5, estimate: 0.51 });
    expect(control.lower).toBeCloseTo(0.5013, 4);
    expect(control.upper).toBeCloseTo(0.5187, 4);

    const state = startSequential({ observed: { labels: ['day', 'evening', 'night'] }, hypothesis: { kind: 'ratio', values: [2, 2, 1] }, alpha: 0.01 });
    expect(state).toEqual({ labels: ['day', 'evening', 'night'], expectedShares: [0.4, 0.4, 0.2], alpha: 0.01, concentration: 100, counts: [0, 0, 0], batches: 0, p: 1 });
    const { state: next, look } = addSequentialBatch(state, [410, 395, 195]);
    expect(next.counts).toEqual([410, 395, 195]);
    expect(look.shares[2]).toMatchObject({ label: 'night', expected: 0.2, estimate: 0.195 });
    expect(look.shares[2].lower).toBeCloseTo(0.1547, 4);
    expect(look.shares[2].upper).toBeCloseTo(0.24, 4);
  });
});
