/**
 * The sequential spec: categories, a hypothesis of fixed shares, α, the prior's concentration and
 * the batches of counts in arrival order. Validated with zod like the analysis spec, every rule
 * with a message naming the field. Only hypotheses that fix the shares before any data arrive can
 * be watched: equal shares, proportions and ratios. Expected counts depend on the total, and a
 * fitted distribution on the data, so neither states a fixed null for a stream.
 */
import { z } from 'zod';
import { hypothesisSchema } from '../spec/analysis-spec';
import { SHARE_SUM_ROUNDING_TOLERANCE } from '../spec/share-tolerance';

/**
 * Prior concentration c (α_i = c · θ0_i). The prior's standard deviation for a share θ0 is
 * √(θ0 (1 − θ0) / (c + 1)): 0.05 for a 50% share at c = 100, so the mixture spreads its bet over
 * deviations of a few percentage points, the size that matters for split and mix checks, and the
 * prior weighs as much as 100 observations, so the data dominate after a few hundred.
 */
export const DEFAULT_CONCENTRATION = 100;

const count = z
  .number({ error: (issue) => (issue.input === undefined ? 'each count is required' : 'each count must be a finite number') })
  .int({ error: 'counts must be whole numbers' })
  .nonnegative({ error: 'counts must not be negative' })
  .max(Number.MAX_SAFE_INTEGER, { error: 'counts must be at most 2^53 − 1' });

/** One batch: a count per category, in the order of the labels. */
export const batchCountsSchema = z.array(count, { error: 'a batch must be an array of whole numbers' });

const label = z
  .string({ error: 'each label must be a string' })
  .refine((value) => value.trim().length > 0, { error: 'labels must not be empty' })
  .refine((value) => value.length <= 200, { error: 'labels must be at most 200 characters' });

export const sequentialAlphaSchema = z
  .number({ error: 'alpha must be a finite number' })
  .gt(0, { error: 'alpha must be above 0' })
  .lt(1, { error: 'alpha must be below 1' });

export const concentrationSchema = z
  .number({ error: 'concentration must be a finite number' })
  .gt(0, { error: 'concentration must be above 0' })
  .max(1e12, { error: 'concentration must be at most 1e12' });

const startShape = {
  observed: z.strictObject({ labels: z.array(label, { error: 'observed.labels must be an array of strings' }) }),
  hypothesis: hypothesisSchema,
  alpha: sequentialAlphaSchema.optional(),
  concentration: concentrationSchema.optional(),
};

type StartShape = z.infer<z.ZodObject<typeof startShape>>;

/** Rules across fields: categories, the hypothesis kind and its values. */
function checkStart(spec: StartShape, addIssue: (path: (string | number)[], message: string) => void): void {
  const labels = spec.observed.labels;
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
  const hypothesis = spec.hypothesis;
  if (hypothesis.kind === 'counts' || hypothesis.kind === 'distribution') {
    addIssue(
      ['hypothesis', 'kind'],
      `a sequential test needs shares fixed in advance: use equal, proportions or ratio (${hypothesis.kind} depends on the data)`,
    );
    return;
  }
  if ((hypothesis.estimatedParameters ?? 0) > 0) {
    addIssue(['hypothesis', 'estimatedParameters'], 'a sequential test needs shares fixed in advance, not estimated from the data');
  }
  if (hypothesis.kind === 'equal') return;
  const values = hypothesis.values;
  if (values.length !== labels.length) {
    addIssue(['hypothesis', 'values'], `hypothesis.values has ${values.length} entries but there are ${labels.length} categories`);
    return;
  }
  const total = values.reduce((sum, value) => sum + value, 0);
  if (hypothesis.kind === 'proportions' && Math.abs(total - 1) > SHARE_SUM_ROUNDING_TOLERANCE) {
    addIssue(['hypothesis', 'values'], `proportions must sum to 1; they sum to ${total}`);
  }
  values.forEach((value, index) => {
    if (value === 0) {
      addIssue(
        ['hypothesis', 'values', index],
        `category "${labels[index]}" has an expected share of 0: a sequential test needs every share above 0`,
      );
    }
  });
}

/** A sequential test without its batches: what `startSequential` takes. */
export const sequentialStartSchema = z.strictObject(startShape).superRefine((spec, context) => {
  checkStart(spec, (path, message) => context.addIssue({ code: 'custom', path, message }));
});

/** The whole sequential spec: what `analyzeSequential` and `tallyfit sequential` take. */
export const sequentialSpecSchema = z
  .strictObject({ ...startShape, batches: z.array(batchCountsSchema, { error: 'batches must be an array of count arrays' }) })
  .superRefine((spec, context) => {
    const addIssue = (path: (string | number)[], message: string) => context.addIssue({ code: 'custom', path, message });
    checkStart(spec, addIssue);
    const k = spec.observed.labels.length;
    let n = 0;
    spec.batches.forEach((batch, index) => {
      if (batch.length !== k) addIssue(['batches', index], `batches.${index} has ${batch.length} counts but there are ${k} categories`);
      for (const value of batch) n += value;
    });
    if (n > Number.MAX_SAFE_INTEGER) addIssue(['batches'], 'the total count must be at most 2^53 − 1');
  });

export type SequentialStartSpec = z.infer<typeof sequentialStartSchema>;
export type SequentialSpec = z.infer<typeof sequentialSpecSchema>;
