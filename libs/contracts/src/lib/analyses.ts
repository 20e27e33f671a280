import { z } from 'zod';
import { analysisSpecSchema, type AnalysisResult } from '@tallyfit/engine';

export const createAnalysisRequestSchema = z.object({
  title: z.string().trim().min(1, { message: 'title must not be empty' }).max(200),
  spec: analysisSpecSchema,
});
export type CreateAnalysisRequest = z.infer<typeof createAnalysisRequestSchema>;

/** An analysis as the API returns it: the stored spec, its result and who ran it with which engine. */
export interface AnalysisRecord {
  id: number;
  title: string;
  spec: CreateAnalysisRequest['spec'];
  result: AnalysisResult;
  engineVersion: string;
  author: { id: number; name: string };
  createdAt: string;
}

/** One row of a list of analyses: enough to browse without loading every result. */
export interface AnalysisSummary {
  id: number;
  title: string;
  hypothesisKind: string;
  n: number;
  k: number;
  p: number | null;
  engineVersion: string;
  author: { id: number; name: string };
  createdAt: string;
}
