import { z } from 'zod';
import {
  analysisSpecBaseSchema,
  analysisSpecSchema,
  segmentAdjustMethods,
  testNames,
  type AnalysisResult,
  type AnalysisSpec,
  type SegmentsResult,
} from '@tallyfit/engine';
import { countSelectionSchema } from './datasets';
import { booleanQueryText, dateQueryText, idText, pageQueryFields } from './pagination';
import { personRefSchema } from './people-ref';

/** Where an analysis is in review: draft → in review → signed off | returned (a returned one can be resubmitted). */
export const ANALYSIS_STATUSES = ['draft', 'in_review', 'signed_off', 'returned'] as const;
export const analysisStatusSchema = z.enum(ANALYSIS_STATUSES);
export type AnalysisStatus = z.infer<typeof analysisStatusSchema>;

const title = z.string().trim().min(1, { message: 'title must not be empty' }).max(200, { message: 'title must be at most 200 characters' });
const notes = z.string().max(10_000, { message: 'notes must be at most 10000 characters' });

const positiveId = (name: string) => z.number().int().positive({ message: `${name} must be a positive whole number` });

/** An analysis of counts sent with the request. */
export const countsAnalysisRequestSchema = z.strictObject({
  title,
  notes: notes.optional(),
  spec: analysisSpecSchema,
  /** The study the analysis belongs to; without it the analysis is the author's own. */
  studyId: positiveId('studyId').optional(),
});
export type CountsAnalysisRequest = z.infer<typeof countsAnalysisRequestSchema>;

/**
 * An analysis of a stored dataset's counts: the selection says which column(s) hold them, `spec`
 * is the engine's spec without `observed` (the dataset's counts fill it in); the analysis belongs
 * to the dataset's study.
 */
export const datasetAnalysisRequestSchema = z.strictObject({
  title,
  notes: notes.optional(),
  datasetId: positiveId('datasetId'),
  selection: countSelectionSchema,
  spec: analysisSpecBaseSchema.omit({ observed: true }),
  /** also test each segment of this column (raw rows only), with the family of p-values adjusted */
  segmentColumn: z.string().trim().min(1, { message: 'segmentColumn must name a column' }).max(200, { message: 'segmentColumn is too long' }).optional(),
  /** how the segment family is adjusted (default holm) */
  segmentAdjust: z.enum(segmentAdjustMethods, { message: `segmentAdjust must be one of ${segmentAdjustMethods.join(', ')}` }).optional(),
});
export type DatasetAnalysisRequest = z.infer<typeof datasetAnalysisRequestSchema>;

/** One way to create an analysis: from counts, or from a dataset. */
export const createAnalysisRequestSchema = z.union([countsAnalysisRequestSchema, datasetAnalysisRequestSchema]);
export type CreateAnalysisRequest = z.infer<typeof createAnalysisRequestSchema>;

export const isDatasetAnalysisRequest = (request: CreateAnalysisRequest): request is DatasetAnalysisRequest => 'datasetId' in request;

export const updateAnalysisRequestSchema = z
  .object({ title: title.optional(), notes: notes.nullable().optional() })
  .refine((body) => body.title !== undefined || body.notes !== undefined, { message: 'send title, notes or both' });
export type UpdateAnalysisRequest = z.infer<typeof updateAnalysisRequestSchema>;

/** Re-run with the stored spec (on today's engine), or with a changed spec. */
export const rerunAnalysisRequestSchema = z.object({ spec: analysisSpecSchema.optional() });
export type RerunAnalysisRequest = z.infer<typeof rerunAnalysisRequestSchema>;

const studyRefSchema = z.object({ id: z.number().int(), name: z.string() });

const analysisCommonShape = {
  id: z.number().int(),
  title: z.string(),
  notes: z.string().nullable(),
  engineVersion: z.string(),
  author: personRefSchema,
  study: studyRefSchema.nullable(),
  datasetId: z.number().int().nullable(),
  status: analysisStatusSchema,
  version: z.number().int(),
  seriesId: z.number().int(),
  previousId: z.number().int().nullable(),
  isLatest: z.boolean(),
  /** the dataset column the analysis was also split by, when it has segments */
  segmentColumn: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
};

/** An analysis as the API returns it: the stored spec, its result and who ran it with which engine. */
export const analysisRecordSchema = z.object({
  ...analysisCommonShape,
  spec: analysisSpecSchema,
  result: z.record(z.string(), z.unknown()).describe("the engine's result (see the engine's AnalysisResult)"),
  segments: z.record(z.string(), z.unknown()).nullable().describe("each segment's test, ranked, with adjusted p-values (the engine's SegmentsResult), or null"),
});
export type AnalysisRecord = Omit<z.infer<typeof analysisRecordSchema>, 'result' | 'spec' | 'segments'> & {
  spec: AnalysisSpec;
  result: AnalysisResult;
  segments: SegmentsResult | null;
};

/** One row of a list of analyses: enough to browse without loading every result. */
export const analysisSummarySchema = z.object({
  ...analysisCommonShape,
  hypothesisKind: z.string(),
  n: z.number().int(),
  k: z.number().int(),
  p: z.number().nullable().describe('the p-value the verdict rests on'),
  alpha: z.number(),
  significant: z.boolean().nullable(),
  tests: z.array(z.string()),
});
export type AnalysisSummary = z.infer<typeof analysisSummarySchema>;

export const HISTORY_SORTS = ['date', 'study', 'author', 'p', 'status'] as const;

/** The history's query string: page, sort and filters (all optional). */
export const listAnalysesQuerySchema = z.object({
  ...pageQueryFields(25),
  sort: z.enum(HISTORY_SORTS, { message: `sort must be one of ${HISTORY_SORTS.join(', ')}` }).default('date'),
  order: z.enum(['asc', 'desc'], { message: 'order must be asc or desc' }).default('desc'),
  studyId: idText('studyId').optional(),
  /** `me` for the caller's own analyses, or a person's id. */
  author: z
    .string()
    .regex(/^(me|[1-9]\d*)$/, { message: 'author must be "me" or a person\'s id' })
    .optional(),
  test: z.enum(testNames, { message: `test must be one of ${testNames.join(', ')}` }).optional(),
  status: analysisStatusSchema.optional(),
  from: dateQueryText('from').optional(),
  to: dateQueryText('to').optional(),
  significant: booleanQueryText('significant').optional(),
  q: z.string().trim().min(1, { message: 'q must not be empty' }).max(200).optional(),
  /** Include earlier versions of re-run analyses (by default only the latest version is listed). */
  allVersions: booleanQueryText('allVersions').optional(),
});
/** The query as a client writes it (all optional, text values). */
export type ListAnalysesQuery = z.input<typeof listAnalysesQuerySchema>;
/** The query after parsing, with defaults filled in. */
export type ListAnalysesFilters = z.output<typeof listAnalysesQuerySchema>;

/** One test's figures before and after a re-run. */
export const testChangeSchema = z.object({
  test: z.string(),
  before: z.object({ statistic: z.number().nullable(), p: z.number() }).nullable(),
  after: z.object({ statistic: z.number().nullable(), p: z.number() }).nullable(),
  statisticDifference: z.number().nullable(),
  pDifference: z.number().nullable(),
});

/** What a re-run changed, compared with the version it re-ran. */
export const analysisChangesSchema = z.object({
  previousId: z.number().int(),
  engineVersion: z.object({ before: z.string(), after: z.string(), changed: z.boolean() }),
  specChanged: z.boolean(),
  tests: z.array(testChangeSchema),
  decision: z.object({
    before: z.boolean(),
    after: z.boolean(),
    changed: z.boolean(),
  }),
  /** Plain sentences for people. */
  summary: z.array(z.string()),
});
export type AnalysisChanges = z.infer<typeof analysisChangesSchema>;

export const rerunAnalysisResponseSchema = z.object({ analysis: analysisRecordSchema, changes: analysisChangesSchema });
export type RerunAnalysisResponse = { analysis: AnalysisRecord; changes: AnalysisChanges };
