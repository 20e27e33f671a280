import { z } from 'zod';

const columnName = (what: string) =>
  z.string().trim().min(1, { message: `${what} must name a column` }).max(200, { message: `${what} is too long` });

/**
 * Which column(s) of a dataset hold the categories:
 * - `raw`: one row per observation, `column` holds each observation's category;
 * - `counts`: one row per category, `labelColumn` names it and `countColumn` holds how many were seen.
 */
export const countSelectionSchema = z.discriminatedUnion('shape', [
  z.object({ shape: z.literal('raw'), column: columnName('column') }),
  z.object({ shape: z.literal('counts'), labelColumn: columnName('labelColumn'), countColumn: columnName('countColumn') }),
]);
export type CountSelection = z.infer<typeof countSelectionSchema>;

export const datasetFileKindSchema = z.enum(['csv', 'tsv', 'xlsx']);
export type DatasetFileKind = z.infer<typeof datasetFileKindSchema>;

export const datasetColumnSchema = z.object({
  name: z.string(),
  /** different non-empty values seen, or null when there were more than the upload keeps track of */
  distinctValues: z.number().int().nullable(),
  /** every non-empty value is a whole number ≥ 0, so the column can hold counts */
  wholeNumbers: z.boolean(),
  emptyCells: z.number().int(),
});
export type DatasetColumn = z.infer<typeof datasetColumnSchema>;

export const categoryCountsSchema = z.object({
  selection: countSelectionSchema,
  labels: z.array(z.string()),
  counts: z.array(z.number().int()),
  total: z.number().int(),
  /** rows left out because the category (or its count) was empty */
  skippedEmpty: z.number().int(),
  /** how thousands separators or decimal marks in a count column were read (see readCountColumn) */
  countDecisions: z.array(z.string()).optional(),
});
export type CategoryCounts = z.infer<typeof categoryCountsSchema>;

/** The counts of a raw category column split by a second column: one row of counts per segment. */
export const segmentCountsSchema = z.object({
  selection: countSelectionSchema,
  segmentColumn: z.string(),
  /** the categories, in the same order in every segment */
  labels: z.array(z.string()),
  segments: z.array(z.object({ segment: z.string(), counts: z.array(z.number().int()), total: z.number().int() })),
  total: z.number().int(),
  /** rows left out because the category was empty */
  skippedEmpty: z.number().int(),
  /** rows left out of the segments because the segment column was empty */
  skippedEmptySegment: z.number().int(),
});
export type SegmentCounts = z.infer<typeof segmentCountsSchema>;

export const datasetSummarySchema = z.object({
  id: z.number().int(),
  studyId: z.number().int(),
  fileName: z.string(),
  kind: datasetFileKindSchema,
  sizeBytes: z.number().int(),
  sha256: z.string(),
  rowCount: z.number().int(),
  columnNames: z.array(z.string()),
  uploadedBy: z.object({ id: z.number().int(), name: z.string() }),
  createdAt: z.string(),
});
export type DatasetSummary = z.infer<typeof datasetSummarySchema>;

export const datasetRecordSchema = datasetSummarySchema.extend({
  columns: z.array(datasetColumnSchema),
  /** the first rows, as text, under the column names */
  preview: z.array(z.array(z.string())),
  /** counts of the columns with few different values, offered at upload so a column can be picked at once */
  offeredCounts: z.array(categoryCountsSchema),
  /** the counts chosen last (at upload or later), if any */
  selectedCounts: categoryCountsSchema.nullable(),
});
export type DatasetRecord = z.infer<typeof datasetRecordSchema>;

/**
 * Optional multipart fields sent beside the file: choosing the shape and column(s) at upload
 * checks them while the file streams, and a file that does not fit is refused whole. Without a
 * shape the file is only stored and profiled (the answer is no selection).
 */
export const datasetUploadFieldsSchema = z
  .strictObject({
    shape: z.enum(['raw', 'counts'], { error: 'shape must be raw or counts' }).optional(),
    column: z.string().optional(),
    labelColumn: z.string().optional(),
    countColumn: z.string().optional(),
  })
  .transform((fields, context): CountSelection | undefined => {
    if (fields.shape === undefined) return undefined;
    const selection = countSelectionSchema.safeParse(fields);
    if (selection.success) return selection.data;
    for (const issue of selection.error.issues) context.addIssue({ code: 'custom', path: issue.path, message: issue.message });
    return z.NEVER;
  });

/** Limits the upload and its summaries keep to (the API states them; the console shows them). */
export const DATASET_PREVIEW_ROWS = 20;
export const DATASET_MAX_CATEGORIES = 1000;
/** Each segment is a test of its own; a family larger than this is no longer read segment by segment. */
export const DATASET_MAX_SEGMENTS = 200;
