import { analyze } from '../analyze';
import { EngineInputError } from '../spec/engine-input-error';
import { standsOut } from './stands-out';

/** Every "p = …" or "p < …" printed in a text, as numbers with their relation. */
function printedPs(text: string): { relation: string; value: number }[] {
  return [...text.matchAll(/p ([=<>]) (\.\d+)/g)].map((match) => ({ relation: match[1], value: Number(`0${match[2]}`) }));
}

function allText(result: ReturnType<typeof analyze>): string {
  return [result.conclusion.verdict, result.report.line, result.report.methods, result.report.results, result.report.table].join('\n');
}

describe('write-ups that never contradict themselves', () => {
  it('never prints p = 0 in the far tail', () => {
    // X² = (610² + 200² + 205² + 205²) / 250 = 1984.6 with 3 df (hand arithmetic); ln p = −988.7287
    // (mpmath 1.3.0: log of the regularised upper gamma Q(3/2, 992.3)), far below a double.
    const result = analyze({ observed: { labels: ['a', 'b', 'c', 'd'], counts: [860, 50, 45, 45] }, hypothesis: { kind: 'equal' } });
    expect(result.tests.pearson?.logP).toBeCloseTo(-988.7287015, 6);
    const text = allText(result);
    expect(text).not.toMatch(/p = 0\b/);
    expect(text).not.toMatch(/p = \.000\b/);
    expect(result.conclusion.verdict).toContain('p < .001');
  });

  it('prints p near alpha with enough digits that the printed value and the decision agree', () => {
    // X² = 2 × 40² / 833 = 3200/833 and p = 0.04999768 (mpmath 1.3.0: Q(1/2, 1600/833)), just below 0.05.
    const result = analyze({ observed: { labels: ['a', 'b'], counts: [873, 793] }, hypothesis: { kind: 'equal' } });
    expect(result.conclusion.p).toBeCloseTo(0.0499976802831417, 14);
    expect(result.conclusion.significant).toBe(true);
    const printed = printedPs(`${result.conclusion.verdict}\n${result.report.line}\n${result.report.results}`);
    expect(printed.length).toBeGreaterThanOrEqual(3);
    for (const { relation, value } of printed) {
      expect(relation === '<' || value < 0.05).toBe(true);
    }
  });

  it('prints w with enough digits that the number and its size word agree', () => {
    // Two equal shares: X² = (O₁ − O₂)² / N, so w = |O₁ − O₂| / N = 738 / 2500 = 0.2952 (Cohen 1988,
    // chapter 7: w = √(X²/N)); below his 0.3 for "medium", so "small".
    const result = analyze({ observed: { labels: ['a', 'b'], counts: [1619, 881] }, hypothesis: { kind: 'equal' } });
    expect(result.effectSize.w).toBeCloseTo(0.2952, 12);
    expect(result.effectSize.size).toBe('small');
    expect(result.report.results).toContain('w = 0.295 (small)');
  });

  it('prints an effect-size interval that contains its estimate', () => {
    // 5001 vs 4999 against 1:1: X² = 4/10000, far below the 2.5% point of χ²(1) (about 0.00098), where the
    // inverted noncentrality interval is empty.
    const result = analyze({ observed: { labels: ['a', 'b'], counts: [5001, 4999] }, hypothesis: { kind: 'equal' } });
    const match = /w = ([\d.]+) \(\w+\), 95% CI \[([\d.]+), ([\d.]+)\]/.exec(result.report.results);
    expect(match).not.toBeNull();
    const [w, low, high] = (match ?? []).slice(1).map(Number);
    expect(low).toBeLessThanOrEqual(w);
    expect(high).toBeGreaterThanOrEqual(w);
    expect(w).toBeGreaterThan(0);
  });

  it('names which residual each column holds', () => {
    const result = analyze({ observed: { labels: ['a', 'b', 'c'], counts: [30, 20, 10] }, hypothesis: { kind: 'equal' } });
    expect(result.report.table).toContain('Gap per √expected, (O − E)/√E');
    expect(result.report.table).toContain('Gap in standard errors, (O − E)/√(E(1 − p₀))');
  });

  it('lists as drivers exactly the categories whose adjusted p is below alpha', () => {
    const result = analyze({
      observed: { labels: ['a', 'b', 'c', 'd', 'e'], counts: [140, 100, 100, 100, 60] },
      hypothesis: { kind: 'equal' },
    });
    const drivers = result.categories.filter((row) => standsOut(row, result.conclusion.alpha)).map((row) => row.label);
    for (const row of result.categories) {
      expect(result.report.results.includes(`"${row.label}" (`)).toBe(drivers.includes(row.label));
    }
  });
});

describe('fitted families with estimated parameters', () => {
  // The exact multinomial test needs fully specified cell probabilities; with parameters fitted to
  // the same counts its p-value is too large, and only the chi-square degrees of freedom allow for
  // the estimate (Cochran 1952, "The χ² test of goodness of fit", Ann. Math. Statist. 23:315; from memory).
  const poisson = { kind: 'distribution' as const, family: 'poisson' as const };
  const observed = { labels: ['0', '1', '2', '3', '4'], counts: [10, 12, 6, 2, 1] };

  it('does not move the decision to the exact test, and says why', () => {
    const result = analyze({ observed, hypothesis: poisson });
    expect(result.assumptions.cochranOk).toBe(false);
    expect(result.tests.exact).toBeUndefined();
    expect(result.conclusion.test).toBe('pearson');
    expect(result.report.methods).toContain('the exact test cannot allow for parameters estimated from the data');
    expect(result.assumptions.advice.map((advice) => advice.code)).not.toContain('use-exact');
    expect(result.warnings.find((warning) => warning.code === 'approximation-doubtful')?.message).toContain('1 parameter (lambda) was estimated');
  });

  it('refuses an explicit request for the exact test, naming the estimate', () => {
    const run = () => analyze({ observed, hypothesis: poisson, tests: ['exact'] });
    expect(run).toThrow(EngineInputError);
    expect(run).toThrow(/tests\.0: the exact test needs fully specified expected shares, but 1 parameter \(lambda\) was estimated/);
  });
});
