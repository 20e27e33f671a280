/**
 * The tests of a result as rows to show side by side: name, statistic, df, p (APA style), and how
 * the p-value was found (for the exact test: counted exactly or simulated, with its standard error).
 */
import { exactHowComputed, TEST_LABELS, type AnalysisResult, type MainTest } from '@tallyfit/engine';
import { formatP, formatStatistic } from '../../core/format/p-value';

export interface TestRow {
  key: MainTest | 'williams';
  name: string;
  symbol: string;
  statistic: string;
  df: string;
  p: string;
  /** how the p-value was found, when that needs saying */
  how: string;
  /** the decision rests on this test */
  main: boolean;
}

/** Very small p-values as a power of ten from log p, where p itself underflows to 0. */
export function smallPNote(p: number, logP: number): string {
  if (p > 0 || !Number.isFinite(logP)) return '';
  const exponent = logP / Math.LN10;
  return `p ≈ 10^${Math.floor(exponent)}`;
}

export function testRows(result: AnalysisResult, williams: boolean): TestRow[] {
  const { tests, conclusion } = result;
  const rows: TestRow[] = [];
  const chiSquare = (key: TestRow['key'], name: string, symbol: string, test: { statistic: number; df: number; p: number; logP: number }, how = '') =>
    rows.push({
      key,
      name,
      symbol,
      statistic: formatStatistic(test.statistic),
      df: String(test.df),
      p: formatP(test.p, conclusion.alpha),
      how: [how, smallPNote(test.p, test.logP)].filter(Boolean).join(' '),
      main: conclusion.test === key,
    });
  if (tests.pearson) chiSquare('pearson', TEST_LABELS.pearson.name, 'X²', tests.pearson);
  if (tests.g) {
    chiSquare('g', TEST_LABELS.g.name, 'G', tests.g);
    if (williams) {
      const corrected = tests.g.williams;
      chiSquare('williams', "G-test with Williams' correction", 'G/q', { ...corrected, df: tests.g.df }, `q = ${corrected.q.toFixed(4)}.`);
    }
  }
  const cressieRead = tests['cressie-read'];
  if (cressieRead) {
    chiSquare('cressie-read', `${TEST_LABELS['cressie-read'].short} (λ = ${Number(cressieRead.lambda.toFixed(3))})`, 'CR', cressieRead);
  }
  if (tests.exact) {
    rows.push({
      key: 'exact',
      name: TEST_LABELS.exact.name,
      symbol: '—',
      statistic: '—',
      df: '—',
      p: formatP(tests.exact.p, conclusion.alpha),
      how: [exactHowComputed(tests.exact), smallPNote(tests.exact.p, tests.exact.logP)].filter(Boolean).join(' '),
      main: conclusion.test === 'exact',
    });
  }
  return rows;
}
