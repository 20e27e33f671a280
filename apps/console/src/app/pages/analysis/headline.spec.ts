import { analyze } from '@tallyfit/engine';
import { headlineFor } from './headline';

describe('headlineFor', () => {
  // McDonald, Handbook of Biological Statistics, 3rd ed. (2014), chi-square test of goodness-of-fit:
  // 1752 green vs 1895 yellow seedlings against 1:1 gives X² = 5.61, 1 df, p = 0.0179.
  const seedlings = analyze({ observed: { labels: ['green', 'yellow'], counts: [1752, 1895] }, hypothesis: { kind: 'equal' } });

  it('says what was tested, the decision and the size in plain words', () => {
    const headline = headlineFor(seedlings);
    expect(headline.question).toBe(`Do 3,647 observations in 2 categories match ${seedlings.hypothesis.description}?`);
    expect(headline.decision).toBe('The observed counts differ from what was expected.');
    expect(headline.evidence).toBe("Pearson's chi-square: p = .018, below the chosen alpha of 0.05.");
    // w = √(5.61 / 3647) ≈ 0.039: below Cohen's 0.1 for "small" (Cohen 1988, chapter 7).
    expect(headline.size).toBe(`The departure is ${seedlings.effectSize.size} (w = 0.04).`);
    expect(headline.differs).toBe(true);
  });

  it('does not claim a large p-value proves the expectation', () => {
    const even = analyze({ observed: { labels: ['a', 'b'], counts: [50, 52] }, hypothesis: { kind: 'equal' } });
    const headline = headlineFor(even);
    expect(headline.decision).toBe('These data could not detect a difference from what was expected.');
    expect(headline.evidence).toContain('not below the chosen alpha of 0.05. This does not show that the expectation holds.');
    // w = 2/102 ≈ 0.02 (two equal shares: w = |O₁ − O₂| / N), negligible by Cohen's (1988) words.
    expect(headline.size).toBe('The estimated departure is negligible (w = 0.02).');
  });
});
