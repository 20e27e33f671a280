/**
 * The third step's choices — which tests, how the exact test runs, corrections, intervals and
 * alpha — turned into the options part of the engine's spec.
 */
import {
  analysisSpecBaseSchema,
  TEST_LABELS,
  testNames,
  type AdjustMethod,
  type AnalysisSpec,
  type ExactMethod,
  type ExactOrdering,
  type IntervalMethod,
  type TestName,
} from '@tallyfit/engine';

export type { ExactMethod, ExactOrdering } from '@tallyfit/engine';

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

/** Each test's heading, the engine's own words. */
export const TEST_NAMES: Record<TestName, string> = Object.fromEntries(
  testNames.map((test) => [test, TEST_LABELS[test].name]),
) as Record<TestName, string>;

/** The options part of the engine's spec schema: it holds every range rule, and its messages are shown as they are. */
const optionsSchema = analysisSpecBaseSchema.omit({ observed: true, hypothesis: true });

/** A field the form requires: left empty, it reaches the schema as a value that is not a number, which it names. */
const required = (value: number | null) => value ?? Number.NaN;

export function buildOptions(draft: OptionsDraft): OptionsOutcome {
  const options: AnalysisOptions = {};
  if (!draft.automaticTests) options.tests = testNames.filter((test) => draft.tests[test]);
  if (draft.automaticTests || draft.tests.exact) {
    const exact: NonNullable<AnalysisSpec['exact']> = { ordering: draft.exactOrdering, method: draft.exactMethod };
    if (draft.exactMethod === 'monte-carlo') {
      if (draft.samples !== null) exact.samples = draft.samples;
      if (draft.seed !== null) exact.seed = draft.seed;
    }
    options.exact = exact;
  }
  if (draft.williams) options.williams = true;
  options.posthoc = { adjust: draft.adjust };
  options.intervals = { method: draft.intervalMethod, level: required(draft.intervalLevel) };
  options.alpha = required(draft.alpha);
  const parsed = optionsSchema.safeParse(options);
  return parsed.success ? { ok: true, options } : { ok: false, errors: parsed.error.issues.map((issue) => issue.message) };
}
