import type { Knex } from 'knex';
import { reviewStateLines, type User } from '@tallyfit/contracts';
import { getReadableAnalysis } from '../analyses/analyses.service';
import type { Config } from '../config';
import { datasetFileName } from '../datasets/datasets.service';
import { listReviews } from '../reviews/reviews.service';
import type { ReportSource } from './report-source';

/** The facts a report needs about an analysis the caller may read (404 otherwise). */
export async function reportSourceFor(db: Knex, caller: User, id: number): Promise<ReportSource> {
  const analysis = await getReadableAnalysis(db, caller, id);
  return {
    id: analysis.id,
    title: analysis.title,
    studyId: analysis.study?.id ?? null,
    studyName: analysis.study?.name ?? null,
    datasetName: await datasetFileName(db, analysis.datasetId),
    authorName: analysis.author.name,
    createdAt: analysis.createdAt,
    engineVersion: analysis.engineVersion,
    notes: analysis.notes,
    reviewLines: reviewStateLines(analysis.status, await listReviews(db, caller, id)),
    result: analysis.result,
    segments: analysis.segments && analysis.segmentColumn ? { column: analysis.segmentColumn, result: analysis.segments } : null,
  };
}

/** The analysis's link in the console, for reports and e-mails. */
export const analysisLink = (config: Pick<Config, 'publicUrl'>, id: number) => `${config.publicUrl}/analyses/${id}`;

/** A download name from the title: letters, digits and dashes only, so no header can be forged. */
export function downloadName(source: Pick<ReportSource, 'id' | 'title'>, extension: string): string {
  const slug = source.title.normalize('NFKD').replace(/[^A-Za-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60).toLowerCase();
  return `analysis-${source.id}${slug ? `-${slug}` : ''}.${extension}`;
}
