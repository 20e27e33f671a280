import { analyze } from '@tallyfit/engine';
import { headlineFor } from './headline';

describe('headline when the test does not reject', () => {
  // 12 counts 3, 1, 0, 6, 2 against five equal shares: X² = 8.83 (E = 2.4 each, hand arithmetic),
  // w = √(X²/12) = 0.858 — large by Cohen's (1988) words — yet the test does not reject. The power
  // of Pearson's test for w = 0.858, 4 df, N = 12 at alpha 0.05 is 0.654 (SciPy 1.17.1:
  // ncx2.sf(chi2.isf(0.05, 4), 4, 12 × 0.858²)), below the conventional 0.80 (Cohen 1988, §2.4).
  const sparse = analyze({ observed: { labels: ['a', 'b', 'c', 'd', 'e'], counts: [3, 1, 0, 6, 2] }, hypothesis: { kind: 'equal' } });
  const headline = headlineFor(sparse);

  it('says the data could not detect a difference, with no reassuring sentence', () => {
    expect(sparse.conclusion.significant).toBe(false);
    expect(headline.decision).toBe('These data could not detect a difference from what was expected.');
    for (const text of [headline.decision, headline.evidence, headline.size]) {
      expect(text).not.toMatch(/consistent with/i);
    }
  });

  it('says the check had too few observations, with the achieved power for the estimated w', () => {
    expect(headline.size).toBe(
      'The check had too few observations: the estimated departure is large (w = 0.86), but with N = 12 a departure that large would be detected only 65% of the time at alpha 0.05.',
    );
  });
});
