/**
 * The written report: methods and results sentences, a Markdown table of the categories, the
 * cautions every report carries, and the whole as one Markdown document.
 */
import type { AnalysisResult, CategoryRow, MainTest, Report } from '../result/analysis-result';
import { effectSizeWord } from '../effect-size/cohens-w';
import { formatEffectSize, formatPercent, groupDigits } from './format-numbers';
import { categoriesMarkdownTable, formatExpectedCount } from './shown-numbers';
import { standsOut } from './stands-out';
import { TEST_LABELS } from '../spec/vocabulary';

export interface WriteUpInput {
  result: Omit<AnalysisResult, 'report' | 'engineVersion'>;
  lines: Report['lines'];
  mainTest: MainTest;
  mainLine: string;
  /** why the main test was chosen */
  reason: string;
  /** extra sentences for the methods paragraph (tail pooling, merges, renormalisation …) */
  notes: string[];
  williamsUsed: boolean;
  merged: boolean;
}


function listInProse(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  if (items.length === 2) return `${items[0]} and ${items[1]}`;
  return `${items.slice(0, -1).join(', ')}, and ${items[items.length - 1]}`;
}

function categoryDeparture(row: CategoryRow): string {
  const direction = row.observed > row.expected ? 'more' : 'fewer';
  return `"${row.label}" (${direction} than expected: ${groupDigits(row.observed)} observed vs ${formatExpectedCount(row.expected)} expected)`;
}

function methodsSentence(input: WriteUpInput): string {
  const { result } = input;
  const others = (Object.keys(input.lines) as MainTest[]).filter((test) => test !== input.mainTest);
  const exactWithBinomial = result.tests.exact?.method === 'binomial';
  const mainName = input.mainTest === 'exact' && exactWithBinomial ? 'the two-sided exact binomial test' : TEST_LABELS[input.mainTest].prose;
  const sentences = [
    `The observed counts in ${result.k} categories (N = ${groupDigits(result.n)}) were compared with ${result.hypothesis.description} using ${mainName}${input.williamsUsed && input.mainTest === 'g' ? " with Williams' correction" : ''}, because ${input.reason}.`,
  ];
  if (others.length > 0) {
    sentences.push(`For comparison, ${listInProse(others.map((test) => TEST_LABELS[test].prose))} ${others.length === 1 ? 'was' : 'were'} also computed.`);
  }
  if (result.tests.exact && result.tests.exact.method === 'monte-carlo') {
    sentences.push(
      `The exact test's p-value was estimated from ${groupDigits(result.tests.exact.samples ?? 0)} simulated samples (standard error ${(result.tests.exact.se ?? 0).toPrecision(2)}).`,
    );
  }
  sentences.push(...input.notes);
  const adjustText =
    result.posthoc.adjust === 'holm'
      ? "adjusted for multiple comparisons with Holm's method"
      : result.posthoc.adjust === 'bonferroni'
        ? 'adjusted for multiple comparisons with the Bonferroni method'
        : 'not adjusted for multiple comparisons';
  const intervalNames = {
    wilson: 'Wilson score intervals (one category at a time)',
    'quesenberry-hurst': 'Quesenberry–Hurst simultaneous intervals',
    goodman: 'Goodman simultaneous intervals',
    'sison-glaz': 'Sison–Glaz simultaneous intervals',
  } as const;
  sentences.push(
    `Each category's count was tested against its expected share with a two-sided exact binomial test, ${adjustText}; observed shares are given with ${formatPercent(result.intervals.level)} ${intervalNames[result.intervals.method]}. The significance level was α = ${result.conclusion.alpha}.`,
  );
  return sentences.join(' ');
}

function resultsSentence(input: WriteUpInput): string {
  const { result } = input;
  const significant = result.conclusion.significant;
  const sentences = [
    significant
      ? `The observed counts differed from the expected counts, ${input.mainLine}.`
      : `The observed counts did not differ detectably from the expected counts, ${input.mainLine}.`,
  ];
  const interval = result.effectSize.interval;
  const shown = formatEffectSize(result.effectSize.w, effectSizeWord, interval);
  sentences.push(
    `The size of the departure was w = ${shown.w} (${result.effectSize.size})${
      interval ? `, ${formatPercent(interval.level)} CI [${shown.low}, ${shown.high}]` : ''
    }.`,
  );
  if (significant) {
    const drivers = result.categories.filter((row) => standsOut(row, result.conclusion.alpha) !== undefined);
    if (drivers.length > 0) {
      sentences.push(`The difference is driven by ${listInProse(drivers.map(categoryDeparture))}.`);
    } else {
      const largest = [...result.categories]
        .sort((a, b) => Math.abs(b.adjustedResidual) - Math.abs(a.adjustedResidual))
        .slice(0, 2);
      sentences.push(
        `No single category differed significantly on its own after adjustment; the largest departures were in ${listInProse(largest.map(categoryDeparture))}.`,
      );
    }
  }
  return sentences.join(' ');
}

function cautions(input: WriteUpInput): string[] {
  const list = [
    'A small p-value does not mean a large or important difference: judge the size by w and by the per-category departures.',
    'A large p-value is not proof that the expected shares hold; it only means these data could not detect a difference.',
    'The test assumes independent observations, each counted in exactly one of a fixed set of categories chosen before looking at the data.',
  ];
  if (input.merged) {
    list.push('Categories were merged before testing, so the test answers a coarser question than the original categories pose.');
  }
  if (input.result.hypothesis.estimatedParameters > 0) {
    list.push(
      'Parameters estimated from the same data make the hypothesis fit the data more closely; the chi-square degrees of freedom were reduced to allow for this (the exact test cannot allow for it and was not used), and the test asks whether the family fits, not whether particular parameter values hold.',
    );
  }
  list.push(
    "Where a decision affects people's health, money or rights, follow your organisation's own procedures and consult a qualified statistician.",
  );
  return list;
}

export function writeUp(input: WriteUpInput): Report {
  const methods = methodsSentence(input);
  const results = resultsSentence(input);
  const table = categoriesMarkdownTable(input.result);
  const cautionList = cautions(input);
  const markdown = [
    '## Method',
    '',
    methods,
    '',
    '## Result',
    '',
    results,
    '',
    table,
    '',
    '## What this does not show',
    '',
    ...cautionList.map((caution) => `- ${caution}`),
    '',
  ].join('\n');
  return { line: input.mainLine, lines: input.lines, methods, results, table, cautions: cautionList, markdown };
}
