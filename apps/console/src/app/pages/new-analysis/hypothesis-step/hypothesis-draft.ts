/**
 * What the hypothesis step's form holds, turned into the engine's `Hypothesis`, and the expected
 * counts it implies for the observed data — computed by the engine itself, in the browser, so the
 * form can show them while the person types.
 */
import { analyze, EngineInputError, type DistributionFamily, type DistributionParams, type Hypothesis } from '@tallyfit/engine';
import type { ParsedCounts } from '../data-step/pasted-counts';
import { SHARE_SUM_ROUNDING_TOLERANCE } from '@tallyfit/engine';

export type HypothesisKind = Hypothesis['kind'];
export type ParamName = keyof DistributionParams;

export interface HypothesisDraft {
  kind: HypothesisKind;
  /** one value per category: a share (proportions) or an expected count (counts) */
  values: (number | null)[];
  /** a ratio written with colons, e.g. "9:3:3:1" */
  ratio: string;
  family: DistributionFamily;
  /** a parameter left empty is estimated from the data where the family allows it */
  params: Partial<Record<ParamName, number | null>>;
  /** bin boundaries for the normal family, e.g. "150, 160, 170" */
  breaks: string;
}

export type HypothesisOutcome = { ok: true; hypothesis: Hypothesis } | { ok: false; errors: string[] };

/** The parameters each family takes, in the order the form shows them; `required` ones cannot be estimated. */
export const FAMILY_PARAMS: Record<DistributionFamily, { name: ParamName; label: string; required: boolean }[]> = {
  poisson: [{ name: 'lambda', label: 'Mean count (lambda)', required: false }],
  binomial: [
    { name: 'trials', label: 'Trials per observation', required: true },
    { name: 'p', label: 'Chance of success (p)', required: false },
  ],
  geometric: [{ name: 'p', label: 'Chance of success (p)', required: false }],
  normal: [
    { name: 'mean', label: 'Mean', required: false },
    { name: 'sd', label: 'Standard deviation', required: false },
  ],
  'discrete-uniform': [
    { name: 'min', label: 'Smallest value', required: false },
    { name: 'max', label: 'Largest value', required: false },
  ],
  benford: [],
};

export const FAMILY_NAMES: Record<DistributionFamily, string> = {
  poisson: 'Poisson (counts of events)',
  binomial: 'Binomial (successes out of a fixed number of trials)',
  geometric: 'Geometric (trials until the first success)',
  normal: 'Normal, in bins',
  'discrete-uniform': 'Every whole value equally likely',
  benford: "Benford's law (first digits 1–9)",
};

/** Shares may miss 1 by rounding (a published table's precision); the engine's rule, renormalised within it. */
export const SHARE_SUM_TOLERANCE = SHARE_SUM_ROUNDING_TOLERANCE;

export function sumOf(values: readonly (number | null)[]): number {
  return values.reduce<number>((total, value) => total + (value ?? 0), 0);
}

function numbersFrom(text: string, separator: RegExp, what: string): { values: number[]; errors: string[] } {
  const parts = text
    .split(separator)
    .map((part) => part.trim())
    .filter((part) => part.length > 0);
  const errors: string[] = [];
  const values = parts.map((part) => {
    const value = Number(part);
    if (!Number.isFinite(value) || value < 0) errors.push(`${what}: "${part}" is not a number of 0 or more.`);
    return value;
  });
  return { values, errors };
}

/** Turns the form's draft into a hypothesis for `k` categories, or says what is missing or wrong. */
export function buildHypothesis(draft: HypothesisDraft, k: number, n: number): HypothesisOutcome {
  switch (draft.kind) {
    case 'equal':
      return { ok: true, hypothesis: { kind: 'equal' } };
    case 'proportions':
    case 'counts': {
      const errors: string[] = [];
      const values = draft.values.slice(0, k);
      if (values.length < k || values.some((value) => value === null || !Number.isFinite(value))) {
        errors.push(`Give an expected ${draft.kind === 'proportions' ? 'share' : 'count'} for every category.`);
      } else if (values.some((value) => (value as number) < 0)) {
        errors.push('Expected values must not be negative.');
      } else {
        const total = sumOf(values);
        if (draft.kind === 'proportions' && Math.abs(total - 1) > SHARE_SUM_TOLERANCE) {
          errors.push(`The shares add up to ${round(total)}; they must add up to 1.`);
        }
        if (draft.kind === 'counts' && Math.abs(total - n) > SHARE_SUM_TOLERANCE * n) {
          errors.push(`The expected counts add up to ${round(total)}; they must add up to the ${n} observations.`);
        }
      }
      return errors.length > 0 ? { ok: false, errors } : { ok: true, hypothesis: { kind: draft.kind, values: values as number[] } };
    }
    case 'ratio': {
      if (draft.ratio.trim() === '') return { ok: false, errors: ['Write the expected ratio, for example 9:3:3:1.'] };
      const { values, errors } = numbersFrom(draft.ratio, /:/, 'Ratio');
      if (errors.length > 0) return { ok: false, errors };
      if (values.length !== k) {
        return { ok: false, errors: [`The ratio has ${values.length} terms but there are ${k} categories.`] };
      }
      if (values.every((value) => value === 0)) return { ok: false, errors: ['The ratio terms must not all be 0.'] };
      return { ok: true, hypothesis: { kind: 'ratio', values } };
    }
    case 'distribution': {
      const params: DistributionParams = {};
      const errors: string[] = [];
      for (const param of FAMILY_PARAMS[draft.family]) {
        const value = draft.params[param.name];
        if (value === null || value === undefined) {
          if (param.required) errors.push(`${param.label} is needed for this family.`);
        } else {
          params[param.name] = value;
        }
      }
      const hypothesis: Hypothesis = { kind: 'distribution', family: draft.family };
      if (Object.keys(params).length > 0) hypothesis.params = params;
      if (draft.family === 'normal') {
        const breaks = numbersFromSigned(draft.breaks);
        if (breaks.errors.length > 0) errors.push(...breaks.errors);
        else if (breaks.values.length !== k - 1) {
          errors.push(`Give ${k - 1} bin boundaries for the ${k} bins (one between each pair of neighbouring bins).`);
        } else hypothesis.breaks = breaks.values;
      }
      return errors.length > 0 ? { ok: false, errors } : { ok: true, hypothesis };
    }
  }
}

function numbersFromSigned(text: string): { values: number[]; errors: string[] } {
  const parts = text
    .split(/[,;\s]+/)
    .map((part) => part.trim())
    .filter((part) => part.length > 0);
  const errors: string[] = [];
  const values = parts.map((part) => {
    const value = Number(part);
    if (!Number.isFinite(value)) errors.push(`Bin boundaries: "${part}" is not a number.`);
    return value;
  });
  return { values, errors };
}

function round(value: number): string {
  return String(Number(value.toPrecision(6)));
}

export interface ExpectedPreviewRow {
  label: string;
  observed: number;
  expected: number;
  expectedShare: number;
}

export type ExpectedPreview =
  | { ok: true; rows: ExpectedPreviewRow[]; df: number; description: string; fitted?: Record<string, number>; warnings: string[] }
  | { ok: false; errors: string[] };

/**
 * The expected counts the hypothesis implies, from the engine (only the Pearson test is run, which
 * is cheap). A fitted family may pool the upper tail, so the rows are the engine's categories.
 */
export function previewExpected(observed: ParsedCounts, hypothesis: Hypothesis): ExpectedPreview {
  try {
    const result = analyze({ observed, hypothesis, tests: ['pearson'] });
    return {
      ok: true,
      rows: result.categories.map(({ label, observed: count, expected, expectedShare }) => ({
        label,
        observed: count,
        expected,
        expectedShare,
      })),
      df: result.df,
      description: result.hypothesis.description,
      fitted: result.hypothesis.fitted,
      // The preview runs only Pearson's test, so the engine's note that the exact test was not run does not apply;
      // the small expected counts are flagged in the table instead.
      warnings: result.warnings.filter((warning) => warning.code !== 'approximation-doubtful').map((warning) => warning.message),
    };
  } catch (error) {
    if (error instanceof EngineInputError) return { ok: false, errors: error.issues.map((issue) => issue.message) };
    throw error;
  }
}
