/**
 * The result's headline in plain words: what was tested, the decision at the chosen alpha, and how
 * large the departure is (Cohen's w and its conventional size word). A test that does not reject
 * says only that the data could not detect a difference; when the estimated departure is medium or
 * large but the check had little power to see it, it says the check had too few observations.
 */
import { effectSizeWord, formatEffectSize, formatPAt, power, TEST_LABELS, type AnalysisResult } from '@tallyfit/engine';

export interface Headline {
  /** what was tested, e.g. "Do 812 observations in 5 categories match equal shares across the 5 categories?" */
  question: string;
  /** the decision, e.g. "The observed counts differ from what was expected." */
  decision: string;
  /** the evidence, e.g. "Pearson's chi-square: p < .001, below the chosen alpha of 0.05." */
  evidence: string;
  /** the size, e.g. "The departure is medium (w = 0.31)." */
  size: string;
  /** the interval for w, printed to the same digits as w, e.g. "95% interval for w: 0.22 to 0.40" */
  interval?: string;
  differs: boolean;
}

/**
 * Power below which a check is called too small to see a departure of the estimated size
 * (Cohen 1988, Statistical Power Analysis, section 2.4: 0.80 as the conventional target).
 */
export const ADEQUATE_POWER = 0.8;

function sizeSentence(result: AnalysisResult): string {
  const { effectSize, conclusion } = result;
  const w = formatEffectSize(effectSize.w, effectSizeWord).w;
  if (conclusion.significant) return `The departure is ${effectSize.size} (w = ${w}).`;
  const worthSeeing = effectSize.size === 'medium' || effectSize.size === 'large';
  if (worthSeeing && effectSize.w > 0) {
    const achieved = power({ w: effectSize.w, df: result.df, n: result.n, alpha: conclusion.alpha }).power;
    if (achieved < ADEQUATE_POWER) {
      const observations = result.n.toLocaleString('en-US');
      return `The check had too few observations: the estimated departure is ${effectSize.size} (w = ${w}), but with N = ${observations} a departure that large would be detected only ${Math.round(achieved * 100)}% of the time at alpha ${conclusion.alpha}.`;
    }
  }
  return `The estimated departure is ${effectSize.size} (w = ${w}).`;
}

function intervalText(w: number, interval: { low: number; high: number; level: number }): string {
  const shown = formatEffectSize(w, effectSizeWord, interval);
  return `${Number((interval.level * 100).toPrecision(6))}% interval for w: ${shown.low} to ${shown.high}`;
}

export function headlineFor(result: AnalysisResult): Headline {
  const { conclusion, hypothesis } = result;
  const differs = conclusion.significant;
  const observations = `${result.n.toLocaleString('en-US')} ${result.n === 1 ? 'observation' : 'observations'}`;
  return {
    question: `Do ${observations} in ${result.k} categories match ${hypothesis.description}?`,
    decision: differs
      ? 'The observed counts differ from what was expected.'
      : 'These data could not detect a difference from what was expected.',
    evidence: `${TEST_LABELS[conclusion.test].short}: ${formatPAt(conclusion.p, conclusion.alpha)}, ${differs ? 'below' : 'not below'} the chosen alpha of ${conclusion.alpha}.${
      differs ? '' : ' This does not show that the expectation holds.'
    }`,
    size: sizeSentence(result),
    ...(result.effectSize.interval ? { interval: intervalText(result.effectSize.w, result.effectSize.interval) } : {}),
    differs,
  };
}
