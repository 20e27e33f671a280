/**
 * The analysis spec: a plain JSON description of the data, the hypothesis and the options.
 * The API validates request bodies with `analysisSpecSchema`, so every rule that can be checked
 * without running the engine lives here, each with a message that names the rule.
 */
import { z } from 'zod';
import { SHARE_SUM_ROUNDING_TOLERANCE } from './share-tolerance';
import { adjustMethods, exactMethods, exactOrderings, intervalMethods, testNames } from './vocabulary';

export {
  adjustMethods,
  exactMethods,
  exactOrderings,
  intervalMethods,
  testNames,
  type AdjustMethod,
  type ExactMethod,
  type ExactOrdering,
  type IntervalMethod,
  type TestName,
} from './vocabulary';

const finiteNumber = (what: string) =>
  z.number({ error: (issue) => (issue.input === undefined ? `${what} is required` : `${what} must be a finite number`) });

const label = z
  .string({ error: 'each label must be a string' })
  .refine((value) => value.trim().length > 0, { error: 'labels must not be empty' })
  .refine((value) => value.length <= 200, { error: 'labels must be at most 200 characters' });

const count = finiteNumber('each count')
  .int({ error: 'counts must be whole numbers' })
  .nonnegative({ error: 'counts must not be negative' })
  .max(Number.MAX_SAFE_INTEGER, { error: 'counts must be at most 2^53 − 1' });

const nonNegativeValue = finiteNumber('each value').nonnegative({ error: 'values must not be negative' });

const estimatedParameters = finiteNumber('estimatedParameters')
  .int({ error: 'estimatedParameters must be a whole number' })
  .nonnegative({ error: 'estimatedParameters must not be negative' })
  .optional();

export const observedSchema = z.strictObject({
  labels: z.array(label, { error: 'observed.labels must be an array of strings' }),
  counts: z.array(count, { error: 'observed.counts must be an array of whole numbers' }),
});

export const distributionFamilies = ['poisson', 'binomial', 'geometric', 'normal', 'discrete-uniform', 'benford'] as const;
export type DistributionFamily = (typeof distributionFamilies)[number];

export const distributionParamsSchema = z.strictObject({
  lambda: finiteNumber('params.lambda').positive({ error: 'params.lambda must be positive' }).optional(),
  p: finiteNumber('params.p')
    .gt(0, { error: 'params.p must be above 0' })
    .max(1, { error: 'params.p must be at most 1' })
    .optional(),
  trials: finiteNumber('params.trials')
    .int({ error: 'params.trials must be a whole number' })
    .positive({ error: 'params.trials must be positive' })
    .optional(),
  mean: finiteNumber('params.mean').optional(),
  sd: finiteNumber('params.sd').positive({ error: 'params.sd must be positive' }).optional(),
  min: finiteNumber('params.min').int({ error: 'params.min must be a whole number' }).optional(),
  max: finiteNumber('params.max').int({ error: 'params.max must be a whole number' }).optional(),
});
export type DistributionParams = z.infer<typeof distributionParamsSchema>;

export const hypothesisSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('equal'), estimatedParameters }),
    z.strictObject({
      kind: z.literal('proportions'),
      values: z.array(nonNegativeValue, { error: 'hypothesis.values must be an array of numbers' }),
      estimatedParameters,
    }),
    z.strictObject({
      kind: z.literal('ratio'),
      values: z.array(nonNegativeValue, { error: 'hypothesis.values must be an array of numbers' }),
      estimatedParameters,
    }),
    z.strictObject({
      kind: z.literal('counts'),
      values: z.array(nonNegativeValue, { error: 'hypothesis.values must be an array of numbers' }),
      estimatedParameters,
    }),
    z.strictObject({
      kind: z.literal('distribution'),
      family: z.enum(distributionFamilies, {
        error: `hypothesis.family must be one of ${distributionFamilies.join(', ')}`,
      }),
      params: distributionParamsSchema.optional(),
      cells: finiteNumber('hypothesis.cells')
        .int({ error: 'hypothesis.cells must be a whole number' })
        .min(2, { error: 'hypothesis.cells must be at least 2' })
        .optional(),
      breaks: z.array(finiteNumber('each break')).optional(),
    }),
  ],
  { error: 'hypothesis.kind must be one of equal, proportions, ratio, counts, distribution' },
);
export type Hypothesis = z.infer<typeof hypothesisSchema>;


export const exactOptionsSchema = z.strictObject({
  ordering: z.enum(exactOrderings, { error: `exact.ordering must be one of ${exactOrderings.join(', ')}` }).optional(),
  method: z.enum(exactMethods, { error: `exact.method must be one of ${exactMethods.join(', ')}` }).optional(),
  samples: finiteNumber('exact.samples')
    .int({ error: 'exact.samples must be a whole number' })
    .min(100, { error: 'exact.samples must be at least 100' })
    .max(100_000_000, { error: 'exact.samples must be at most 100000000' })
    .optional(),
  seed: finiteNumber('exact.seed')
    .int({ error: 'exact.seed must be a whole number' })
    .min(0, { error: 'exact.seed must not be negative' })
    .max(2 ** 32 - 1, { error: 'exact.seed must be below 2^32' })
    .optional(),
});


export const mergedCategorySchema = z.strictObject({
  label,
  members: z.array(label).min(2, { error: 'a merged category needs at least 2 members' }),
});

export const analysisSpecBaseSchema = z.strictObject({
  observed: observedSchema,
  hypothesis: hypothesisSchema,
  tests: z
    .array(z.enum(testNames, { error: `each test must be one of ${testNames.join(', ')}` }))
    .min(1, { error: 'tests must name at least one test' })
    .optional(),
  exact: exactOptionsSchema.optional(),
  williams: z.boolean({ error: 'williams must be true or false' }).optional(),
  cressieReadLambda: finiteNumber('cressieReadLambda')
    .gt(-1, { error: 'cressieReadLambda must be above -1 (at -1 and below, empty categories make the statistic infinite)' })
    .max(10, { error: 'cressieReadLambda must be at most 10' })
    .optional(),
  posthoc: z
    .strictObject({
      adjust: z.enum(adjustMethods, { error: `posthoc.adjust must be one of ${adjustMethods.join(', ')}` }),
    })
    .optional(),
  intervals: z
    .strictObject({
      method: z.enum(intervalMethods, { error: `intervals.method must be one of ${intervalMethods.join(', ')}` }),
      level: finiteNumber('intervals.level')
        .gt(0, { error: 'intervals.level must be above 0' })
        .lt(1, { error: 'intervals.level must be below 1' })
        .optional(),
    })
    .optional(),
  alpha: finiteNumber('alpha').gt(0, { error: 'alpha must be above 0' }).lt(1, { error: 'alpha must be below 1' }).optional(),
  /** categories merged before testing (set by mergeCategories); the write-up's cautions mention it */
  mergedCategories: z.array(mergedCategorySchema).optional(),
  /** sentences the methods paragraph must carry, e.g. the note mergeCategories returns */
  notes: z
    .array(z.string({ error: 'each note must be a string' }).max(2000, { error: 'a note must be at most 2000 characters' }))
    .max(20, { error: 'at most 20 notes' })
    .optional(),
});

type SpecShape = z.infer<typeof analysisSpecBaseSchema>;

function sum(values: readonly number[]): number {
  let total = 0;
  for (const value of values) total += value;
  return total;
}

/** Rules that relate several fields: lengths, duplicates, shares that add up, impossible counts. */
export function checkSpecConsistency(spec: SpecShape, addIssue: (path: (string | number)[], message: string) => void): void {
  const { labels, counts } = spec.observed;
  if (labels.length !== counts.length) {
    addIssue(['observed', 'counts'], `observed.counts has ${counts.length} entries but observed.labels has ${labels.length}`);
    return;
  }
  if (labels.length < 2) {
    addIssue(['observed', 'labels'], `at least 2 categories are needed, got ${labels.length}`);
    return;
  }
  const seen = new Map<string, number>();
  labels.forEach((value, index) => {
    const first = seen.get(value);
    if (first !== undefined) addIssue(['observed', 'labels', index], `duplicate label "${value}" (also at position ${first})`);
    else seen.set(value, index);
  });
  const n = sum(counts);
  if (n === 0) addIssue(['observed', 'counts'], 'all counts are zero: at least one observation is needed');
  if (n > Number.MAX_SAFE_INTEGER) addIssue(['observed', 'counts'], 'the total count must be at most 2^53 − 1');

  const hypothesis = spec.hypothesis;
  if (hypothesis.kind === 'proportions' || hypothesis.kind === 'ratio' || hypothesis.kind === 'counts') {
    const values = hypothesis.values;
    if (values.length !== labels.length) {
      addIssue(['hypothesis', 'values'], `hypothesis.values has ${values.length} entries but there are ${labels.length} categories`);
      return;
    }
    const total = sum(values);
    if (total <= 0) {
      addIssue(['hypothesis', 'values'], 'hypothesis.values must not all be zero');
      return;
    }
    if (hypothesis.kind === 'proportions' && Math.abs(total - 1) > SHARE_SUM_ROUNDING_TOLERANCE) {
      addIssue(['hypothesis', 'values'], `proportions must sum to 1; they sum to ${total}`);
    }
    if (hypothesis.kind === 'counts' && n > 0 && Math.abs(total - n) > SHARE_SUM_ROUNDING_TOLERANCE * n) {
      addIssue(
        ['hypothesis', 'values'],
        `expected counts must sum to the observed total ${n}; they sum to ${total} (give proportions or a ratio instead)`,
      );
    }
    values.forEach((value, index) => {
      if (value === 0 && counts[index] > 0) {
        addIssue(
          ['hypothesis', 'values', index],
          `category "${labels[index]}" is expected to be empty (value 0) but has ${counts[index]} observations`,
        );
      }
    });
  }
  const estimated = hypothesis.kind === 'distribution' ? 0 : (hypothesis.estimatedParameters ?? 0);
  if (estimated > 0 && labels.length - 1 - estimated < 1) {
    addIssue(
      ['hypothesis', 'estimatedParameters'],
      `with ${labels.length} categories at most ${labels.length - 2} parameters can be estimated (degrees of freedom must stay at least 1)`,
    );
  }
  if (spec.tests) {
    const seenTests = new Set<string>();
    spec.tests.forEach((test, index) => {
      if (seenTests.has(test)) addIssue(['tests', index], `test "${test}" is listed twice`);
      seenTests.add(test);
    });
  }
}

/** The full spec schema, with the cross-field rules. */
export const analysisSpecSchema = analysisSpecBaseSchema.superRefine((spec, context) => {
  checkSpecConsistency(spec, (path, message) => context.addIssue({ code: 'custom', path, message }));
});

export type AnalysisSpec = z.infer<typeof analysisSpecSchema>;
