/**
 * The result's headline in plain words: what was tested, the decision at the chosen alpha, and how
 * large the departure is (Cohen's w and its conventional size word).
 */
import type { AnalysisResult, MainTest } from '@tallyfit/engine';
import { formatP } from '../../core/format/p-value';

export interface Headline {
  /** what was tested, e.g. "Do 812 observations in 5 categories match equal shares across the 5 categories?" */
  question: string;
  /** the decision, e.g. "Yes, the counts differ from what was expected." */
  decision: string;
  /** the evidence, e.g. "Pearson's chi-square: p < .001, below the chosen alpha of 0.05." */
  evidence: string;
  /** the size, e.g. "The departure is medium (w = 0.31)." */
  size: string;
  differs: boolean;
}

export const TEST_TITLES: Record<MainTest, string> = {
  pearson: "Pearson's chi-square",
  g: 'G-test',
  cressieRead: 'Cressie–Read',
  exact: 'Exact multinomial test',
};

export function headlineFor(result: AnalysisResult): Headline {
  const { conclusion, effectSize, hypothesis } = result;
  const differs = conclusion.significant;
  const observations = `${result.n.toLocaleString('en-US')} ${result.n === 1 ? 'observation' : 'observations'}`;
  return {
    question: `Do ${observations} in ${result.k} categories match ${hypothesis.description}?`,
    decision: differs
      ? 'The observed counts differ from what was expected.'
      : 'The observed counts are consistent with what was expected.',
    evidence: `${TEST_TITLES[conclusion.test]}: p ${formatP(conclusion.p)}, ${differs ? 'below' : 'not below'} the chosen alpha of ${conclusion.alpha}.${
      differs ? '' : ' This does not prove the expectation holds.'
    }`,
    size: `The departure is ${effectSize.size} (w = ${effectSize.w.toFixed(2)}).`,
    differs,
  };
}
