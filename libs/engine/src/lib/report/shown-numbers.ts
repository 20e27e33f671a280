/**
 * What every page and report prints for a result: the console's tables, the Markdown and PDF
 * reports, the CSV and the shared e-mail all read these cells, so a reader who puts two of them
 * side by side sees the same digits. APA style (Publication Manual of the American Psychological
 * Association, 7th ed., 2020, section 6.36): p without a leading zero and `< .001` below that,
 * statistics to two decimals, and as many digits as it takes for a difference to show.
 */
import { effectSizeWord } from '../effect-size/cohens-w';
import type { AnalysisResult, ExactTestResult } from '../result/analysis-result';
import { TEST_LABELS, type TestName } from '../spec/vocabulary';
import { formatEffectSize, formatPValueAt, formatStatistic, groupDigits } from './format-numbers';

/** The most decimals a share is ever given; beyond this two shares are the same for any reader. */
const MAX_SHARE_DECIMALS = 6;

/** A true minus sign, as typeset tables print it (the CSV writes the ASCII hyphen back). */
const withMinus = (text: string) => text.replace(/^-/, '−');

/**
 * The decimals for every share of a result (observed, expected and both interval ends): three,
 * or more where three would print an observed share equal to its expected share although they
 * differ (0.5004 against 0.5 is "0.500 vs 0.500" at three, "0.5004 vs 0.5000" at four), or print a
 * non-zero share as 0. One count for the whole table keeps the column aligned and both ends of an
 * interval printed alike.
 */
export function shareDecimals(result: Pick<AnalysisResult, 'categories'>): number {
  let decimals = 3;
  const hidden = (d: number) =>
    result.categories.some(
      (row) =>
        (row.share !== row.expectedShare && row.share.toFixed(d) === row.expectedShare.toFixed(d)) ||
        (row.share > 0 && Number(row.share.toFixed(d)) === 0) ||
        (row.expectedShare > 0 && Number(row.expectedShare.toFixed(d)) === 0),
    );
  while (decimals < MAX_SHARE_DECIMALS && hidden(decimals)) decimals++;
  return decimals;
}

/** An expected count: two decimals (312.75), grouped; tiny ones to two significant digits so they never read 0. */
export function formatExpectedCount(value: number): string {
  if (value > 0 && value < 0.005) return value.toPrecision(2);
  const [whole, decimals] = value.toFixed(2).split('.');
  return `${groupDigits(Number(whole))}.${decimals}`;
}

/** One category as printed everywhere; numbers as text, minus signs typeset. */
export interface CategoryCells {
  label: string;
  observed: string;
  expected: string;
  share: string;
  expectedShare: string;
  /** (O − E) / √E */
  residual: string;
  /** (O − E) / √(E (1 − expected share)): how many standard errors the count is from its expectation */
  gap: string;
  /** the per-category p the table shows: adjusted unless the adjustment is `none` */
  p: string;
  intervalLow: string;
  intervalHigh: string;
}

/** Every category of a result as the cells every output prints. */
export function categoryCells(result: Pick<AnalysisResult, 'categories' | 'conclusion' | 'posthoc'>): CategoryCells[] {
  const decimals = shareDecimals(result);
  const share = (value: number) => value.toFixed(decimals);
  return result.categories.map((row) => ({
    label: row.label,
    observed: groupDigits(row.observed),
    expected: formatExpectedCount(row.expected),
    share: share(row.share),
    expectedShare: share(row.expectedShare),
    residual: withMinus(formatStatistic(row.residual)),
    gap: withMinus(formatStatistic(row.adjustedResidual)),
    p: formatPValueAt(result.posthoc.adjust === 'none' ? row.p : row.pAdjusted, result.conclusion.alpha),
    intervalLow: share(row.interval.low),
    intervalHigh: share(row.interval.high),
  }));
}

/** The headings of the per-category table, in our own words; the same in every output. */
export function categoryHeadings(result: Pick<AnalysisResult, 'posthoc' | 'intervals'>): Record<keyof CategoryCells, string> {
  const level = `${Number((result.intervals.level * 100).toPrecision(6))}%`;
  return {
    label: 'Category',
    observed: 'Counted',
    expected: 'Expected',
    share: 'Share counted',
    expectedShare: 'Share expected',
    residual: 'Gap per √expected',
    gap: 'Gap in standard errors',
    p: { holm: 'p (Holm)', bonferroni: 'p (Bonferroni)', none: 'p' }[result.posthoc.adjust],
    intervalLow: `${level} range, low`,
    intervalHigh: `${level} range, high`,
  };
}

/** How an exact test's p-value was found, in words. */
export function exactHowComputed(exact: ExactTestResult): string {
  const ordering = { probability: 'outcomes no more likely than the data', llr: 'G at least as large', pearson: 'X² at least as large' }[exact.ordering];
  switch (exact.method) {
    case 'binomial':
      return 'Exact binomial test (two categories).';
    case 'enumerate':
      return `Every possible outcome counted; extreme means ${ordering}.${
        exact.massBound ? ` At most ${exact.massBound.toExponential(1)} of probability left out.` : ''
      }`;
    case 'monte-carlo':
      return `Simulated from ${groupDigits(exact.samples ?? 0)} samples (seed ${exact.seed ?? 0}); Monte Carlo standard error ${(exact.se ?? 0).toPrecision(2)}; extreme means ${ordering}.`;
  }
}

/** One test as printed everywhere. */
export interface TestCells {
  key: TestName;
  name: string;
  statistic: string;
  df: string;
  p: string;
  /** how the p-value was found */
  how: string;
}

/** Every test that ran, in the spec's order, as the cells every output prints. */
export function testCells(result: Pick<AnalysisResult, 'tests' | 'conclusion'>): TestCells[] {
  const alpha = result.conclusion.alpha;
  const rows: TestCells[] = [];
  const { pearson, g, exact } = result.tests;
  const cressieRead = result.tests['cressie-read'];
  const chiSquareHow = (df: number) => `Chi-square distribution with ${df} ${df === 1 ? 'degree' : 'degrees'} of freedom.`;
  if (pearson) rows.push({ key: 'pearson', name: TEST_LABELS.pearson.name, statistic: formatStatistic(pearson.statistic), df: String(pearson.df), p: formatPValueAt(pearson.p, alpha), how: chiSquareHow(pearson.df) });
  if (g) rows.push({ key: 'g', name: TEST_LABELS.g.name, statistic: formatStatistic(g.statistic), df: String(g.df), p: formatPValueAt(g.p, alpha), how: chiSquareHow(g.df) });
  if (cressieRead) {
    rows.push({
      key: 'cressie-read',
      name: `${TEST_LABELS['cressie-read'].short} (λ = ${Number(cressieRead.lambda.toFixed(3))})`,
      statistic: formatStatistic(cressieRead.statistic),
      df: String(cressieRead.df),
      p: formatPValueAt(cressieRead.p, alpha),
      how: chiSquareHow(cressieRead.df),
    });
  }
  if (exact) rows.push({ key: 'exact', name: TEST_LABELS.exact.name, statistic: '—', df: '—', p: formatPValueAt(exact.p, alpha), how: exactHowComputed(exact) });
  return rows;
}

/** Cohen's w with its size word and interval, e.g. "w = 0.12 (small), 95% CI [0.08, 0.16]". */
export function effectSizeText(result: Pick<AnalysisResult, 'effectSize'>): string {
  const { w, size, interval } = result.effectSize;
  const shown = formatEffectSize(w, effectSizeWord, interval);
  const range = interval ? `, ${Number((interval.level * 100).toPrecision(6))}% CI [${shown.low}, ${shown.high}]` : '';
  return `w = ${shown.w} (${size})${range}`;
}

/** The per-category table as Markdown, with the same cells and headings as every other output. */
export function categoriesMarkdownTable(result: Pick<AnalysisResult, 'categories' | 'conclusion' | 'posthoc' | 'intervals'>): string {
  const headings = categoryHeadings(result);
  const escape = (text: string) => text.replace(/\|/g, '\\|').replace(/\r?\n/g, ' ');
  const header = [headings.label, headings.observed, headings.expected, headings.share, headings.expectedShare, `${headings.gap}, (O − E)/√(E(1 − p₀))`, `${headings.residual}, (O − E)/√E`, headings.p, headings.intervalLow.replace(/, low$/, '')];
  const rows = categoryCells(result).map((cells) => [
    escape(cells.label),
    cells.observed,
    cells.expected,
    cells.share,
    cells.expectedShare,
    cells.gap,
    cells.residual,
    cells.p,
    `${cells.intervalLow} – ${cells.intervalHigh}`,
  ]);
  const align = header.map((_, index) => (index === 0 ? '---' : '---:'));
  return [header, align, ...rows].map((cells) => `| ${cells.join(' | ')} |`).join('\n');
}
