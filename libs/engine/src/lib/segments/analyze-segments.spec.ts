import { adjustPValues } from '../posthoc/adjust-p-values';
import { EngineInputError } from '../spec/engine-input-error';
import { expectClose } from '../../testing/expect-close';
import { analyzeSegments } from './analyze-segments';
import fixtures from './fixtures/adjust-fixtures.json';

// Reference values from fixtures/make-adjust-fixtures.py (SciPy and NumPy versions recorded in the
// JSON): Benjamini–Hochberg by scipy.stats.false_discovery_control, Holm by a statsmodels-free
// reimplementation that the script checks against Benjamini & Hochberg (1995), section 4.
describe('the family adjustments used for segments', () => {
  it.each(fixtures.cases.map((c) => [c.name, c] as const))('match SciPy’s Benjamini–Hochberg and the reference Holm: %s', (_name, reference) => {
    adjustPValues(reference.p, 'benjamini-hochberg').forEach((value, i) => expectClose(value, reference.bh[i], { relative: 1e-12, absolute: 1e-15 }, `BH ${i}`));
    adjustPValues(reference.p, 'holm').forEach((value, i) => expectClose(value, reference.holm[i], { relative: 1e-12, absolute: 1e-15 }, `Holm ${i}`));
  });

  it('rejects four hypotheses by Benjamini–Hochberg and three by Holm in the 1995 worked example', () => {
    // Benjamini & Hochberg (1995), J. R. Statist. Soc. B 57(1):289–300, section 4 (from memory; also by hand from the definitions).
    const p = fixtures.cases[0].p;
    expect(adjustPValues(p, 'benjamini-hochberg').filter((value) => value <= 0.05)).toHaveLength(4);
    expect(adjustPValues(p, 'holm').filter((value) => value <= 0.05)).toHaveLength(3);
  });
});

describe('analyzeSegments', () => {
  const equal = { hypothesis: { kind: 'equal' as const } };

  it('tests each segment, adjusts the family with Holm by default and ranks by p', () => {
    const result = analyzeSegments({
      spec: equal,
      labels: ['green', 'yellow'],
      segments: [
        // Invented: an even split, X² = 0 and p = 1 by hand.
        { segment: 'even plot', counts: [500, 500] },
        // McDonald, Handbook of Biological Statistics, 3rd ed. (2014): 1752 vs 1895 under 1:1, X² = 5.6071, p = 0.0179.
        { segment: 'field trial', counts: [1752, 1895] },
      ],
    });
    expect(result.adjust).toBe('holm');
    expect(result.familySize).toBe(2);
    expect(result.rows.map((row) => [row.segment, row.rank])).toEqual([
      ['field trial', 1],
      ['even plot', 2],
    ]);
    const [trial, even] = result.rows;
    expect(trial.test).toBe('pearson');
    expectClose(trial.statistic!, 5.6071, { absolute: 5e-5 }, 'X² of the field trial');
    expectClose(trial.p!, 0.0179, { absolute: 5e-5 }, 'p of the field trial');
    // Holm with m = 2: the smallest p doubled (0.0358), the largest max(0.0358, 1 × 1) = 1.
    expectClose(trial.pAdjusted!, 2 * trial.p!, { relative: 1e-12 }, 'Holm, smallest');
    expect(even.pAdjusted).toBe(1);
    expect(trial.significant).toBe(true);
    expect(trial.drivers.map((driver) => [driver.label, driver.direction])).toEqual([
      ['green', 'fewer'],
      ['yellow', 'more'],
    ]);
    expect(result.report.paragraph).toMatch(/^The same test was run in each of 2 segments/);
    expect(result.report.paragraph).toContain('field trial (χ²(1, N = 3,647) = 5.61, p = .018, adjusted p = .036, w = 0.04; more “yellow”, fewer “green” than expected)');
  });

  it('adjusts with Benjamini–Hochberg when asked', () => {
    const result = analyzeSegments({
      spec: equal,
      labels: ['green', 'yellow'],
      adjust: 'benjamini-hochberg',
      segments: [
        { segment: 'even plot', counts: [500, 500] },
        { segment: 'field trial', counts: [1752, 1895] },
      ],
    });
    // BH with m = 2: the smallest p × 2 / 1, the largest min(1, 2 × 1 / 2) = 1.
    expectClose(result.rows[0].pAdjusted!, 2 * result.rows[0].p!, { relative: 1e-12 });
    expect(result.report.paragraph).toContain('Benjamini–Hochberg');
  });

  it('flags a segment too small for the chi-square approximation and keeps it in the family', () => {
    const result = analyzeSegments({
      spec: equal,
      labels: ['heads', 'tails'],
      segments: [
        { segment: 'large', counts: [60, 40] },
        // Expected 2 and 2, below 5: Cochran's rule fails, so the exact binomial test is used:
        // two-sided P(X ≤ 1 or X ≥ 3 | n = 4, ½) = (1 + 4 + 4 + 1) / 16 = 0.625, by hand.
        { segment: 'tiny', counts: [3, 1] },
      ],
    });
    const tiny = result.rows.find((row) => row.segment === 'tiny')!;
    expect(tiny.flag?.code).toBe('too-small');
    expect(tiny.test).toBe('exact');
    expectClose(tiny.p!, 0.625, { relative: 1e-12 });
    expect(result.familySize).toBe(2);
    expect(result.flaggedCount).toBe(1);
    expect(result.report.paragraph).toContain('tiny, N = 4');
  });

  it('keeps a segment without observations in the table, outside the family', () => {
    const result = analyzeSegments({
      spec: equal,
      labels: ['a', 'b'],
      segments: [
        { segment: 'full', counts: [10, 12] },
        { segment: 'empty', counts: [0, 0] },
      ],
    });
    expect(result.familySize).toBe(1);
    expect(result.rows.at(-1)).toMatchObject({ segment: 'empty', n: 0, flag: { code: 'not-tested', message: 'no observations in this segment' } });
    expect(result.rows.at(-1)!.rank).toBeUndefined();
    expect(result.report.table.split('\n')).toHaveLength(4);
  });

  it('names the field of bad input', () => {
    const error = (input: unknown) => {
      try {
        analyzeSegments(input as never);
      } catch (caught) {
        expect(caught).toBeInstanceOf(EngineInputError);
        return (caught as EngineInputError).issues;
      }
      throw new Error('no error thrown');
    };
    expect(error({ spec: equal, labels: ['a', 'b'], segments: [{ segment: 's', counts: [1, 2, 3] }] })).toEqual([
      { path: 'segments.0.counts', message: 'segment "s" has 3 counts but there are 2 labels' },
    ]);
    expect(error({ spec: { hypothesis: { kind: 'counts', values: [1, 2] } }, labels: ['a', 'b'], segments: [{ segment: 's', counts: [1, 2] }] })[0].path).toBe('spec.hypothesis.kind');
    expect(error({ spec: equal, labels: ['a', 'b'], segments: [{ segment: 's', counts: [1, 2] }, { segment: 's', counts: [2, 1] }] })[0].message).toBe('segment "s" appears twice');
  });
});
