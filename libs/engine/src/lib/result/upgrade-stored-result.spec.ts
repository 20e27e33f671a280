import { analyze } from '../analyze';
import { testNames } from '../spec/vocabulary';
import type { AnalysisResult } from './analysis-result';
import { upgradeStoredResult } from './upgrade-stored-result';

describe('results stored by engine 0.1.x', () => {
  const current = analyze({
    observed: { labels: ['a', 'b', 'c'], counts: [30, 20, 10] },
    hypothesis: { kind: 'equal' },
    tests: ['cressie-read', 'pearson'],
  });
  // What 0.1.x stored for the same analysis: the Cressie–Read test keyed `cressieRead` everywhere.
  const { 'cressie-read': cressieTest, ...otherTests } = current.tests;
  const { 'cressie-read': cressieLine, ...otherLines } = current.report.lines;
  const stored = {
    ...current,
    tests: { cressieRead: cressieTest, ...otherTests },
    report: { ...current.report, lines: { cressieRead: cressieLine, ...otherLines } },
    conclusion: { ...current.conclusion, test: 'cressieRead' },
  } as unknown as AnalysisResult;

  it('read like new ones, every key a spec test name', () => {
    const upgraded = upgradeStoredResult(stored);
    expect(upgraded.tests).toEqual(current.tests);
    expect(upgraded.report.lines).toEqual(current.report.lines);
    expect(upgraded.conclusion.test).toBe('cressie-read');
    for (const key of [...Object.keys(upgraded.tests), ...Object.keys(upgraded.report.lines)]) {
      expect(testNames).toContain(key);
    }
  });

  it('come back unchanged when already in the new form', () => {
    expect(upgradeStoredResult(current)).toBe(current);
  });
});
