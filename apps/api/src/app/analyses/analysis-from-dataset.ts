import type { Knex } from 'knex';
import { parseAnalysisSpec } from '@tallyfit/engine';
import type { AnalysisRecord, DatasetAnalysisRequest, User } from '@tallyfit/contracts';
import type { EngineRunner } from '../engine/engine-runner';
import { countsForSelection, segmentsOfDataset } from '../datasets/datasets.service';
import { createAnalysis } from './analyses.service';

/**
 * An analysis of a dataset's counts: the chosen column(s) fill the spec's observed counts, and the
 * analysis belongs to the dataset's study. The spec is checked again once the counts are known
 * (its shares must match the dataset's categories). With a segment column, every segment's counts
 * (one pass over the file for the split) are tested against the same spec and kept with it.
 */
export async function createAnalysisFromDataset(
  db: Knex,
  dataDir: string,
  engine: EngineRunner,
  caller: User,
  request: DatasetAnalysisRequest,
): Promise<AnalysisRecord> {
  const split = request.segmentColumn === undefined ? undefined : await segmentsOfDataset(db, dataDir, caller, request.datasetId, request.selection, request.segmentColumn);
  const { dataset, counts } = await countsForSelection(db, dataDir, caller, request.datasetId, request.selection);
  const spec = parseAnalysisSpec({ ...request.spec, observed: { labels: counts.labels, counts: counts.counts } });
  return createAnalysis(db, engine, caller, {
    title: request.title,
    notes: request.notes,
    spec,
    studyId: dataset.studyId,
    datasetId: dataset.id,
    ...(split
      ? {
          segments: {
            column: split.segmentColumn,
            input: {
              spec: request.spec,
              labels: split.labels,
              segments: split.segments.map(({ segment, counts: segmentCounts }) => ({ segment, counts: segmentCounts })),
              adjust: request.segmentAdjust,
              segmentName: split.segmentColumn,
            },
          },
        }
      : {}),
  });
}
