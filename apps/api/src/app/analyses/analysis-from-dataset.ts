import type { Knex } from 'knex';
import { parseAnalysisSpec } from '@tallyfit/engine';
import type { AnalysisRecord, DatasetAnalysisRequest, User } from '@tallyfit/contracts';
import type { EngineRunner } from '../engine/engine-runner';
import { countsForSelection } from '../datasets/datasets.service';
import { createAnalysis } from './analyses.service';

/**
 * An analysis of a dataset's counts: the chosen column(s) fill the spec's observed counts, and the
 * analysis belongs to the dataset's study. The spec is checked again once the counts are known
 * (its shares must match the dataset's categories).
 */
export async function createAnalysisFromDataset(
  db: Knex,
  dataDir: string,
  engine: EngineRunner,
  caller: User,
  request: DatasetAnalysisRequest,
): Promise<AnalysisRecord> {
  const { dataset, counts } = await countsForSelection(db, dataDir, caller, request.datasetId, request.selection);
  const spec = parseAnalysisSpec({ ...request.spec, observed: { labels: counts.labels, counts: counts.counts } });
  return createAnalysis(db, engine, caller, {
    title: request.title,
    notes: request.notes,
    spec,
    studyId: dataset.studyId,
    datasetId: dataset.id,
  });
}
