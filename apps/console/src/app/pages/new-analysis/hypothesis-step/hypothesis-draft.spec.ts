import { buildHypothesis, previewExpected, type HypothesisDraft } from './hypothesis-draft';

const draft = (overrides: Partial<HypothesisDraft>): HypothesisDraft => ({
  kind: 'equal',
  values: [],
  ratio: '',
  family: 'poisson',
  params: {},
  breaks: '',
  ...overrides,
});

/** k categories holding n observations between them (the first takes what does not divide evenly). */
const observedOf = (k: number, n: number) => ({
  labels: Array.from({ length: k }, (_, index) => `c${index + 1}`),
  counts: Array.from({ length: k }, (_, index) => Math.floor(n / k) + (index === 0 ? n % k : 0)),
});

// The messages are the engine's own (its spec schema), shown as they are.
describe('buildHypothesis', () => {
  it('accepts shares that add up to 1 and refuses ones that do not, saying the sum', () => {
    expect(buildHypothesis(draft({ kind: 'proportions', values: [0.5, 0.3, 0.2] }), observedOf(3, 10))).toEqual({
      ok: true,
      hypothesis: { kind: 'proportions', values: [0.5, 0.3, 0.2] },
    });
    expect(buildHypothesis(draft({ kind: 'proportions', values: [0.5, 0.3, 0.3] }), observedOf(3, 10))).toEqual({
      ok: false,
      errors: ['proportions must sum to 1; they sum to 1.1'],
    });
  });

  it('allows shares rounded to a published table’s precision', () => {
    expect(buildHypothesis(draft({ kind: 'proportions', values: [0.333, 0.333, 0.333] }), observedOf(3, 10)).ok).toBe(true);
  });

  it('asks for a value in every category', () => {
    expect(buildHypothesis(draft({ kind: 'counts', values: [5, null] }), observedOf(2, 10))).toEqual({
      ok: false,
      errors: ['each value is required'],
    });
  });

  it('checks that expected counts add up to the number of observations', () => {
    expect(buildHypothesis(draft({ kind: 'counts', values: [5, 4] }), observedOf(2, 10))).toEqual({
      ok: false,
      errors: ['expected counts must sum to the observed total 10; they sum to 9 (give proportions or a ratio instead)'],
    });
  });

  it('reads a ratio and checks it has one term per category', () => {
    expect(buildHypothesis(draft({ kind: 'ratio', ratio: '9:3:3:1' }), observedOf(4, 10))).toEqual({
      ok: true,
      hypothesis: { kind: 'ratio', values: [9, 3, 3, 1] },
    });
    expect(buildHypothesis(draft({ kind: 'ratio', ratio: '1:2:1' }), observedOf(4, 10))).toEqual({
      ok: false,
      errors: ['hypothesis.values has 3 entries but there are 4 categories'],
    });
    expect(buildHypothesis(draft({ kind: 'ratio', ratio: '3:x' }), observedOf(2, 10))).toEqual({
      ok: false,
      errors: ['Ratio: "x" is not a number.'],
    });
  });

  it('leaves an empty parameter to be estimated but insists on the binomial’s trials', () => {
    expect(buildHypothesis(draft({ kind: 'distribution', family: 'poisson', params: { lambda: null } }), observedOf(4, 10))).toEqual({
      ok: true,
      hypothesis: { kind: 'distribution', family: 'poisson' },
    });
    expect(buildHypothesis(draft({ kind: 'distribution', family: 'binomial', params: { p: 0.5 } }), observedOf(4, 10))).toEqual({
      ok: false,
      errors: ['Trials per observation is needed for this family.'],
    });
  });

  it('needs one bin boundary fewer than bins for the normal family', () => {
    expect(buildHypothesis(draft({ kind: 'distribution', family: 'normal', breaks: '10, 20' }), observedOf(4, 10))).toEqual({
      ok: false,
      errors: ['Give 3 bin boundaries for the 4 bins (one between each pair of neighbouring bins).'],
    });
    expect(buildHypothesis(draft({ kind: 'distribution', family: 'normal', breaks: '-1 0 1' }), observedOf(4, 10))).toEqual({
      ok: true,
      hypothesis: { kind: 'distribution', family: 'normal', breaks: [-1, 0, 1] },
    });
  });
});

describe('previewExpected', () => {
  it('shows the expected counts of a 9:3:3:1 ratio (n × 9/16 and so on)', () => {
    const preview = previewExpected({ labels: ['a', 'b', 'c', 'd'], counts: [90, 35, 25, 10] }, { kind: 'ratio', values: [9, 3, 3, 1] });
    expect(preview.ok).toBe(true);
    if (!preview.ok) return;
    // 160 observations: 160·9/16 = 90, 160·3/16 = 30, 160·1/16 = 10 (arithmetic, common practice).
    expect(preview.rows.map((row) => row.expected)).toEqual([90, 30, 30, 10]);
    expect(preview.df).toBe(3);
  });

  it('fits a Poisson mean from the data and removes a degree of freedom', () => {
    // counts of 0, 1, 2, 3 events: mean = (0·10 + 1·20 + 2·15 + 3·5) / 50 = 65 / 50 = 1.3
    const preview = previewExpected({ labels: ['0', '1', '2', '3'], counts: [10, 20, 15, 5] }, { kind: 'distribution', family: 'poisson' });
    expect(preview.ok).toBe(true);
    if (!preview.ok) return;
    expect(preview.fitted?.['lambda']).toBeCloseTo(1.3, 12);
    // Poisson(1.3) probability of 0 is e^−1.3 = 0.272532 (arithmetic), times 50 observations.
    expect(preview.rows[0].expected).toBeCloseTo(50 * Math.exp(-1.3), 9);
    expect(preview.df).toBe(2);
  });

  it('returns the engine’s message when the data cannot carry the hypothesis', () => {
    const preview = previewExpected({ labels: ['low', 'high'], counts: [3, 4] }, { kind: 'distribution', family: 'poisson' });
    expect(preview).toEqual({ ok: false, errors: ['for a poisson fit each label must be a whole number (the counted value), got "low"'] });
  });
});
