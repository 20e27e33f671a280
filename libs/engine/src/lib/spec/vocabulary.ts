/**
 * The engine's option vocabulary, said once: the names the spec accepts, the keys the result uses
 * and the words people read for each test. The spec schema, the exact test, the result types, the
 * API's contracts and the console all read these lists.
 */

/** Tests a spec may ask for; also the keys of `result.tests`, `report.lines` and `conclusion.test`. */
export const testNames = ['pearson', 'g', 'exact', 'cressie-read'] as const;
export type TestName = (typeof testNames)[number];

/** What "at least as extreme" means for the exact test. */
export const exactOrderings = ['probability', 'llr', 'pearson'] as const;
export type ExactOrdering = (typeof exactOrderings)[number];

/** How the exact test may be computed, as a spec asks for it. */
export const exactMethods = ['auto', 'enumerate', 'monte-carlo'] as const;
export type ExactMethod = (typeof exactMethods)[number];

/** How the exact test was computed, as the result reports it (`binomial`: two categories, probability ordering). */
export const exactResultMethods = ['enumerate', 'monte-carlo', 'binomial'] as const;
export type ExactResultMethod = (typeof exactResultMethods)[number];

/** Multiplicity adjustments of the per-category p-values. */
export const adjustMethods = ['holm', 'bonferroni', 'none'] as const;
export type AdjustMethod = (typeof adjustMethods)[number];

/** Intervals for each category's share (Wilson one at a time; the others simultaneous). */
export const intervalMethods = ['wilson', 'goodman', 'quesenberry-hurst', 'sison-glaz'] as const;
export type IntervalMethod = (typeof intervalMethods)[number];

export interface TestLabel {
  /** a column or list heading, e.g. "G-test (likelihood ratio)" */
  name: string;
  /** where space is short, e.g. "G-test" */
  short: string;
  /** inside a sentence, e.g. "the likelihood-ratio G-test" */
  prose: string;
}

/** The words for each test, for every page and report. */
export const TEST_LABELS: Record<TestName, TestLabel> = {
  pearson: { name: "Pearson's chi-square", short: "Pearson's chi-square", prose: "Pearson's chi-square goodness-of-fit test" },
  g: { name: 'G-test (likelihood ratio)', short: 'G-test', prose: 'the likelihood-ratio G-test' },
  exact: { name: 'Exact multinomial test', short: 'Exact multinomial', prose: 'the exact multinomial test' },
  'cressie-read': { name: 'Cressie–Read power divergence', short: 'Cressie–Read', prose: 'the Cressie–Read power-divergence test' },
};
