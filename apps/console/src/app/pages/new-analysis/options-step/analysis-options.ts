/**
 * The third step's choices — which tests, how the exact test runs, corrections, intervals and
 * alpha — turned into the options part of the engine's spec.
 */
import type { AdjustMethod, AnalysisSpec, IntervalMethod, TestName } from '@tallyfit/engine';

export type ExactOrdering = NonNullable<AnalysisSpec['exact']>['ordering'] & string;
export type ExactMethod = NonNullable<AnalysisSpec['exact']>['method'] & string;

export interface OptionsDraft {
  /** let the engine choose: Pearson and G, plus the exact test when the expected counts are small */
  automaticTests: boolean;
  tests: Record<TestName, boolean>;
  exactOrdering: ExactOrdering;
  exactMethod: ExactMethod;
  samples: number | null;
  seed: number | null;
  williams: boolean;
  adjust: AdjustMethod;
  intervalMethod: IntervalMethod;
  intervalLevel: number | null;
  alpha: number | null;
}

export type AnalysisOptions = Omit<AnalysisSpec, 'observed' | 'hypothesis'>;
export type OptionsOutcome = { ok: true; options: AnalysisOptions } | { ok: false; errors: string[] };

export const DEFAULT_OPTIONS: OptionsDraft = {
  automaticTests: true,
  tests: { pearson: true, g: true, exact: false, 'cressie-read': false },
  exactOrdering: 'probability',
  exactMethod: 'auto',
  samples: null,
  seed: null,
  williams: false,
  adjust: 'holm',
  intervalMethod: 'wilson',
  intervalLevel: 0.95,
  alpha: 0.05,
};

export const TEST_NAMES: Record<TestName, string> = {
  pearson: "Pearson's chi-square",
  g: 'G-test (likelihood ratio)',
  exact: 'Exact multinomial test',
  'cressie-read': 'Cressie–Read power divergence',
};

export function buildOptions(draft: OptionsDraft): OptionsOutcome {
  const errors: string[] = [];
  const options: AnalysisOptions = {};
  const tests = (Object.keys(draft.tests) as TestName[]).filter((test) => draft.tests[test]);
  if (!draft.automaticTests) {
    if (tests.length === 0) errors.push('Choose at least one test, or let Tallyfit choose.');
    else options.tests = tests;
  }
  const exactMayRun = draft.automaticTests || draft.tests.exact;
  if (exactMayRun) {
    const exact: NonNullable<AnalysisSpec['exact']> = { ordering: draft.exactOrdering, method: draft.exactMethod };
    if (draft.exactMethod === 'monte-carlo') {
      if (draft.samples !== null) {
        if (!Number.isInteger(draft.samples) || draft.samples < 100 || draft.samples > 100_000_000) {
          errors.push('Simulated samples must be a whole number from 100 to 100,000,000.');
        } else exact.samples = draft.samples;
      }
      if (draft.seed !== null) {
        if (!Number.isInteger(draft.seed) || draft.seed < 0 || draft.seed >= 2 ** 32) {
          errors.push('The seed must be a whole number from 0 to 4,294,967,295.');
        } else exact.seed = draft.seed;
      }
    }
    options.exact = exact;
  }
  if (draft.williams) options.williams = true;
  options.posthoc = { adjust: draft.adjust };
  if (draft.intervalLevel === null || !(draft.intervalLevel > 0 && draft.intervalLevel < 1)) {
    errors.push('The interval level must be between 0 and 1, for example 0.95.');
  } else options.intervals = { method: draft.intervalMethod, level: draft.intervalLevel };
  if (draft.alpha === null || !(draft.alpha > 0 && draft.alpha < 1)) {
    errors.push('Alpha must be between 0 and 1, for example 0.05.');
  } else options.alpha = draft.alpha;
  return errors.length > 0 ? { ok: false, errors } : { ok: true, options };
}
