/**
 * Segments: the same spec applied to each slice of the data (counts per segment, e.g. per browser
 * or per line), each slice tested on its own, the family of segment p-values adjusted — Holm
 * (1979, Scand. J. Statist. 6:65–70) by default, Benjamini & Hochberg (1995, J. R. Statist. Soc. B
 * 57(1):289–300) as an option — and the segments ranked by p. A segment too small for the chosen
 * test is flagged, not dropped; a segment that cannot be tested at all (no observations, or an
 * input the test refuses) stays in the table with the reason and outside the family.
 */
import { z } from 'zod';
import { analyze } from '../analyze';
import { ENGINE_VERSION } from '../engine-version';
import { adjustPValues } from '../posthoc/adjust-p-values';
import type { AnalysisResult, EffectSizeWord, MainTest } from '../result/analysis-result';
import { analysisSpecBaseSchema } from '../spec/analysis-spec';
import { EngineInputError } from '../spec/engine-input-error';
import { segmentsWriteUp } from './segments-write-up';

export const segmentAdjustMethods = ['holm', 'benjamini-hochberg'] as const;
export type SegmentAdjustMethod = (typeof segmentAdjustMethods)[number];

/** At most this many segments: each is a test, and a longer family is no longer read segment by segment. */
export const MAX_SEGMENTS = 1000;

const count = z.number({ error: 'each count must be a number' }).int({ error: 'each count must be a whole number' }).min(0, { error: 'counts must not be negative' });

export const segmentsInputSchema = z
  .strictObject({
    /** the spec every segment is tested against, without `observed` (each segment's counts fill it) */
    spec: analysisSpecBaseSchema.omit({ observed: true }),
    /** the categories, in the order of every segment's counts */
    labels: z.array(z.string().trim().min(1, { error: 'each label must not be empty' }).max(200)).min(2, { error: 'at least 2 categories are needed' }),
    segments: z
      .array(
        z.strictObject({
          segment: z.string().trim().min(1, { error: 'each segment needs a name' }).max(200, { error: 'a segment name must be at most 200 characters' }),
          counts: z.array(count),
        }),
      )
      .min(1, { error: 'at least one segment is needed' })
      .max(MAX_SEGMENTS, { error: `at most ${MAX_SEGMENTS} segments` }),
    /** how the family of segment p-values is adjusted (default holm) */
    adjust: z.enum(segmentAdjustMethods, { error: `adjust must be one of ${segmentAdjustMethods.join(', ')}` }).optional(),
    /** what the segments are, for the write-up (e.g. "browser") */
    segmentName: z.string().trim().min(1).max(200).optional(),
  })
  .superRefine((input, context) => {
    const seen = new Set<string>();
    input.segments.forEach((segment, i) => {
      if (segment.counts.length !== input.labels.length) {
        context.addIssue({ code: 'custom', path: ['segments', i, 'counts'], message: `segment "${segment.segment}" has ${segment.counts.length} counts but there are ${input.labels.length} labels` });
      }
      if (seen.has(segment.segment)) context.addIssue({ code: 'custom', path: ['segments', i, 'segment'], message: `segment "${segment.segment}" appears twice` });
      seen.add(segment.segment);
    });
    if (input.spec.hypothesis.kind === 'counts') {
      context.addIssue({
        code: 'custom',
        path: ['spec', 'hypothesis', 'kind'],
        message: 'expected counts fit one total, not every segment; give the expectation as proportions or a ratio',
      });
    }
  });
export type SegmentsInput = z.input<typeof segmentsInputSchema>;

/** A category that drives a segment's departure: its own test is significant after the in-segment adjustment. */
export interface SegmentDriver {
  label: string;
  observed: number;
  expected: number;
  direction: 'more' | 'fewer';
}

export interface SegmentFlag {
  /** `too-small`: tested, but too small for the chi-square approximation (Cochran's rule); `not-tested`: outside the family */
  code: 'too-small' | 'not-tested';
  message: string;
}

export interface SegmentRow {
  segment: string;
  n: number;
  /** 1 for the smallest p; absent for a segment that was not tested */
  rank?: number;
  flag?: SegmentFlag;
  /** the test the segment's p comes from, its statistic (absent for the exact test) and df */
  test?: MainTest;
  statistic?: number;
  df?: number;
  p?: number;
  pAdjusted?: number;
  /** pAdjusted < alpha */
  significant?: boolean;
  w?: number;
  size?: EffectSizeWord;
  /** the APA-style statistics line of the segment's test */
  line?: string;
  drivers: SegmentDriver[];
  /** observed and expected count per category (the categories tested), for charts */
  categories: Array<{ label: string; observed: number; expected: number }>;
}

export interface SegmentsResult {
  labels: string[];
  adjust: SegmentAdjustMethod;
  alpha: number;
  /** segments in the adjusted family (the tested ones) */
  familySize: number;
  significantCount: number;
  flaggedCount: number;
  /** tested segments by p (smallest first), then those not tested */
  rows: SegmentRow[];
  /** `table`: Markdown; `paragraph`: the write-up */
  report: { table: string; paragraph: string };
  engineVersion: string;
}

function parseSegmentsInput(input: unknown) {
  const parsed = segmentsInputSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw new EngineInputError(parsed.error.issues.map((issue) => ({ path: issue.path.map(String).join('.'), message: issue.message })));
}

const statisticOf = (result: AnalysisResult): number | undefined => {
  const test = result.conclusion.test;
  return test === 'exact' ? undefined : result.tests[test]?.statistic;
};

const dfOf = (result: AnalysisResult): number | undefined => {
  const test = result.conclusion.test;
  return test === 'exact' ? result.df : result.tests[test]?.df;
};

function driversOf(result: AnalysisResult): SegmentDriver[] {
  return result.categories
    .filter((category) => category.pAdjusted < result.conclusion.alpha)
    .sort((a, b) => Math.abs(b.residual) - Math.abs(a.residual))
    .slice(0, 3)
    .map((category) => ({
      label: category.label,
      observed: category.observed,
      expected: category.expected,
      direction: category.observed > category.expected ? 'more' : 'fewer',
    }));
}

/**
 * Tests every segment against the same spec and adjusts the family of p-values.
 *
 * @throws EngineInputError naming the field when the input is not valid (counts that do not
 *   match the labels, a repeated segment, expected counts given as `counts`).
 */
export function analyzeSegments(input: SegmentsInput): SegmentsResult {
  const { spec, labels, segments, segmentName } = parseSegmentsInput(input);
  const adjust = input.adjust ?? 'holm';
  const alpha = spec.alpha ?? 0.05;

  const analysed = segments.map(({ segment, counts }) => {
    const n = counts.reduce((a, b) => a + b, 0);
    if (n === 0) return { segment, n, error: 'no observations in this segment' };
    try {
      return { segment, n, result: analyze({ ...spec, observed: { labels, counts } }) };
    } catch (error) {
      if (error instanceof EngineInputError) return { segment, n, error: error.issues.map((issue) => issue.message).join('; ') };
      throw error;
    }
  });

  const tested = analysed.filter((entry): entry is { segment: string; n: number; result: AnalysisResult } => 'result' in entry && entry.result !== undefined);
  const adjusted = adjustPValues(
    tested.map((entry) => entry.result.conclusion.p),
    adjust,
  );
  const testedRows: SegmentRow[] = tested.map(({ segment, n, result }, i) => {
    const tooSmall = !result.assumptions.cochranOk;
    return {
      segment,
      n,
      ...(tooSmall
        ? {
            flag: {
              code: 'too-small' as const,
              message:
                result.conclusion.test === 'exact'
                  ? "too small for the chi-square approximation (Cochran's rule); its p is from the exact test"
                  : "too small for the chosen test (Cochran's rule fails); read its p with care or add the exact test",
            },
          }
        : {}),
      test: result.conclusion.test,
      statistic: statisticOf(result),
      df: dfOf(result),
      p: result.conclusion.p,
      pAdjusted: adjusted[i],
      significant: adjusted[i] < alpha,
      w: result.effectSize.w,
      size: result.effectSize.size,
      line: result.report.line,
      drivers: driversOf(result),
      categories: result.categories.map((category) => ({ label: category.label, observed: category.observed, expected: category.expected })),
    };
  });
  testedRows.sort((a, b) => a.p! - b.p! || b.n - a.n || a.segment.localeCompare(b.segment));
  testedRows.forEach((row, i) => (row.rank = i + 1));

  const untestedRows: SegmentRow[] = analysed
    .filter((entry): entry is { segment: string; n: number; error: string } => 'error' in entry && entry.error !== undefined)
    .map(({ segment, n, error }) => ({
      segment,
      n,
      flag: { code: 'not-tested', message: error },
      drivers: [],
      categories: [],
    }));

  const rows = [...testedRows, ...untestedRows];
  const partial = {
    labels,
    adjust,
    alpha,
    familySize: testedRows.length,
    significantCount: testedRows.filter((row) => row.significant).length,
    flaggedCount: rows.filter((row) => row.flag).length,
    rows,
  };
  return { ...partial, report: segmentsWriteUp(partial, segmentName), engineVersion: ENGINE_VERSION };
}
