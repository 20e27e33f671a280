/**
 * What the hypothesis step's form holds, turned into the engine's `Hypothesis`, and the expected
 * counts it implies for the observed data — computed by the engine itself, in the browser, so the
 * form can show them while the person types.
 */
import { analysisSpecSchema, analyze, EngineInputError, type DistributionFamily, type DistributionParams, type Hypothesis } from '@tallyfit/engine';
import type { ParsedCounts } from '../data-step/pasted-counts';

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
    if (!Number.isFinite(value)) errors.push(`${what}: "${part}" is not a number.`);
    return value;
  });
  return { values, errors };
}

/**
 * The engine's own verdict on a hypothesis for these data: its spec schema holds every rule
 * (values given and not negative, one per category, shares adding up to 1 within the rounding
 * tolerance, expected counts adding up to N), and its messages are shown as they are.
 */
function engineIssues(observed: ParsedCounts, hypothesis: unknown): string[] {
  const parsed = analysisSpecSchema.safeParse({ observed, hypothesis });
  if (parsed.success) return [];
  return parsed.error.issues.filter((issue) => issue.path[0] === 'hypothesis').map((issue) => issue.message);
}

/** Turns the form's draft into a hypothesis for the observed categories, or says what is missing or wrong. */
export function buildHypothesis(draft: HypothesisDraft, observed: ParsedCounts): HypothesisOutcome {
  const k = observed.labels.length;
  let hypothesis: Hypothesis;
  switch (draft.kind) {
    case 'equal':
      hypothesis = { kind: 'equal' };
      break;
    case 'proportions':
    case 'counts': {
      // An empty field reaches the schema as an empty value, which it names ("each value is required").
      const values = Array.from({ length: k }, (_, index) => draft.values[index] ?? undefined);
      hypothesis = { kind: draft.kind, values: values as number[] };
      break;
    }
    case 'ratio': {
      if (draft.ratio.trim() === '') return { ok: false, errors: ['Write the expected ratio, for example 9:3:3:1.'] };
      const { values, errors } = numbersFrom(draft.ratio, /:/, 'Ratio');
      if (errors.length > 0) return { ok: false, errors };
      hypothesis = { kind: 'ratio', values };
      break;
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
      hypothesis = { kind: 'distribution', family: draft.family };
      if (Object.keys(params).length > 0) hypothesis.params = params;
      if (draft.family === 'normal') {
        const breaks = numbersFromSigned(draft.breaks);
        if (breaks.errors.length > 0) errors.push(...breaks.errors);
        else if (breaks.values.length !== k - 1) {
          errors.push(`Give ${k - 1} bin boundaries for the ${k} bins (one between each pair of neighbouring bins).`);
        } else hypothesis.breaks = breaks.values;
      }
      if (errors.length > 0) return { ok: false, errors };
      break;
    }
  }
  const errors = engineIssues(observed, hypothesis);
  return errors.length > 0 ? { ok: false, errors } : { ok: true, hypothesis };
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

/** The kinds a stream of batches can be tested against: shares fixed before any count arrives (the engine's rule for sequential tests). */
export const STREAM_KINDS: readonly HypothesisKind[] = ['equal', 'proportions', 'ratio'];

/**
 * The expected shares of a hypothesis with shares fixed in advance, before any count has arrived
 * (a watch). Such shares do not depend on the counts, so one observation per category stands in
 * for the data to let the engine compute them.
 */
export function previewShares(labels: readonly string[], hypothesis: Hypothesis): ExpectedPreview {
  if (!STREAM_KINDS.includes(hypothesis.kind)) {
    return { ok: false, errors: ['A watch needs shares fixed in advance: every category equal, a share for each, or a ratio.'] };
  }
  return previewExpected({ labels: [...labels], counts: labels.map(() => 1) }, hypothesis);
}

/** The form's draft for a hypothesis already given (a watch being changed). */
export function draftFromHypothesis(hypothesis: Hypothesis): HypothesisDraft {
  const draft: HypothesisDraft = { kind: hypothesis.kind, values: [], ratio: '', family: 'poisson', params: {}, breaks: '' };
  switch (hypothesis.kind) {
    case 'proportions':
    case 'counts':
      return { ...draft, values: [...hypothesis.values] };
    case 'ratio':
      return { ...draft, ratio: hypothesis.values.join(':') };
    case 'distribution':
      return { ...draft, family: hypothesis.family, params: { ...hypothesis.params }, breaks: (hypothesis.breaks ?? []).join(', ') };
    default:
      return draft;
  }
}
