import type { DatasetBatchRequest, PushBatchResponse, User } from '@tallyfit/contracts';
import { countsForSelection } from '../datasets/datasets.service';
import { unprocessable } from '../http/http-error';
import { takeInBatch } from './batch-intake';
import { getChangeableWatchRow } from './watch-access';
import type { WatchContext } from './watch-context';

/**
 * Appends a dataset of the watch's study as a batch: the chosen column(s) are counted as for an
 * analysis (raw rows or a table of labels and counts), then taken in like a pushed batch. The
 * idempotency key defaults to the dataset, so the same upload is appended once.
 */
export async function appendDatasetBatch(ctx: WatchContext, dataDir: string, caller: User, watchId: number, request: DatasetBatchRequest): Promise<PushBatchResponse> {
  const watch = await getChangeableWatchRow(ctx.db, caller, watchId);
  const { dataset, counts } = await countsForSelection(ctx.db, dataDir, caller, request.datasetId, request.selection);
  if (dataset.studyId !== watch.study_id) {
    throw unprocessable(`dataset ${dataset.id} belongs to another study than watch ${watchId}`, [{ path: 'datasetId', message: "not a dataset of the watch's study" }]);
  }
  return takeInBatch(ctx, watchId, caller, {
    source: 'upload',
    idempotencyKey: request.idempotencyKey ?? `dataset-${dataset.id}`,
    periodStart: request.periodStart,
    periodEnd: request.periodEnd,
    counts: Object.fromEntries(counts.labels.map((label, i) => [label, counts.counts[i]])),
    datasetId: dataset.id,
  });
}
