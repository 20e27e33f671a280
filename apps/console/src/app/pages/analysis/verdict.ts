import { formatP } from '../../core/format/p-value';

export interface Verdict {
  differs: boolean;
  headline: string;
  detail: string;
}

/** The decision at the chosen alpha in plain words, with the p-value it rests on. */
export function verdictFor(p: number, alpha: number): Verdict {
  const differs = p < alpha;
  return {
    differs,
    headline: differs
      ? 'The observed counts differ from what was expected.'
      : 'The observed counts are consistent with what was expected.',
    detail: differs
      ? `p ${formatP(p)} is below the chosen alpha of ${alpha}.`
      : `p ${formatP(p)} is not below the chosen alpha of ${alpha}; this does not prove the expectation holds.`,
  };
}
