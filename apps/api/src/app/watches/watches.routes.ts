import {
  acknowledgeAlertRequestSchema,
  createWatchRequestSchema,
  datasetBatchRequestSchema,
  idParamsSchema,
  listAlertsQuerySchema,
  listBatchesQuerySchema,
  listWatchesQuerySchema,
  pageSchema,
  pushBatchRequestSchema,
  pushBatchResponseSchema,
  resumeWatchRequestSchema,
  updateWatchRequestSchema,
  watchAlertSchema,
  watchBatchSchema,
  watchDetailSchema,
  watchSchema,
} from '@tallyfit/contracts';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import { takeInBatch } from './batch-intake';
import { appendDatasetBatch } from './dataset-batch';
import { getChangeableWatchRow } from './watch-access';
import { acknowledgeAlert, listAlerts } from './watch-alerts.service';
import { listBatches } from './watch-batches';
import type { WatchContext } from './watch-context';
import { createWatch, deleteWatch, getWatch, listWatches, pauseWatch, resumeWatch, updateWatch } from './watches.service';

const batchAnswer = {
  201: { description: 'the batch was taken in and tested', schema: pushBatchResponseSchema },
  200: { description: 'the idempotency key was seen before: the stored batch, counted once', schema: pushBatchResponseSchema },
};

export function watchesRoutes(ctx: WatchContext, dataDir: string): RouteDefinition[] {
  const { db } = ctx;
  return [
    defineRoute({
      method: 'get',
      path: '/watches',
      access: 'watches.read',
      summary: 'The watches the caller may read, those in alarm first; filter by study, state, feed, waiting alarm or text',
      request: { query: listWatchesQuerySchema },
      responses: { 200: pageSchema(watchSchema) },
      handler: async ({ query, user, res }) => {
        res.json(await listWatches(db, user, query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/watches',
      access: 'watches.manage',
      summary: 'Create a watch in a study: categories, hypothesis, alpha, feed and an optional signed webhook',
      request: { body: createWatchRequestSchema },
      responses: { 201: watchDetailSchema },
      handler: async ({ body, user, res }) => {
        res.status(201).json(await createWatch(ctx, user, body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/watches/:id',
      access: 'watches.read',
      summary: 'One watch with the latest shares and their confidence sequences',
      request: { params: idParamsSchema },
      responses: { 200: watchDetailSchema },
      handler: async ({ params, user, res }) => {
        res.json(await getWatch(db, user, params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/watches/:id',
      access: 'watches.manage',
      summary: 'Edit a watch (categories, hypothesis and alpha only before its first batch or after a restart)',
      request: { params: idParamsSchema, body: updateWatchRequestSchema },
      responses: { 200: watchDetailSchema },
      handler: async ({ params, body, user, res }) => {
        res.json(await updateWatch(ctx, user, params.id, body));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/watches/:id',
      access: 'watches.manage',
      summary: 'Delete a watch (its batches, analyses and alerts are kept)',
      request: { params: idParamsSchema },
      responses: { 204: { description: 'deleted' } },
      handler: async ({ params, user, res }) => {
        await deleteWatch(ctx, user, params.id);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'post',
      path: '/watches/:id/pause',
      access: 'watches.pause',
      summary: 'Pause a watch: it takes no batches and skips its scheduled pulls',
      request: { params: idParamsSchema },
      responses: { 200: watchDetailSchema },
      handler: async ({ params, user, res }) => {
        res.json(await pauseWatch(ctx, user, params.id));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/watches/:id/resume',
      access: 'watches.pause',
      summary: 'Resume a paused watch; with restart, a fresh sequential test begins and an alarm is cleared',
      request: { params: idParamsSchema, body: resumeWatchRequestSchema },
      responses: { 200: watchDetailSchema },
      handler: async ({ params, body, user, res }) => {
        res.json(await resumeWatch(ctx, user, params.id, body.restart));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/watches/:id/batches',
      access: 'watches.read',
      summary: "A watch's batches in order, each with its own analysis and the sequential test's look after it",
      request: { params: idParamsSchema, query: listBatchesQuerySchema },
      responses: { 200: pageSchema(watchBatchSchema) },
      handler: async ({ params, query, user, res }) => {
        res.json(await listBatches(db, user, params.id, query.page, query.pageSize));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/watches/:id/batches',
      access: 'watches.manage',
      summary: 'Push one period’s counts (every category of the watch, by label) with an idempotency key; a personal API token works',
      request: { params: idParamsSchema, body: pushBatchRequestSchema },
      responses: batchAnswer,
      handler: async ({ params, body, user, res }) => {
        await getChangeableWatchRow(db, user, params.id);
        const answer = await takeInBatch(ctx, params.id, user, { source: 'push', ...body });
        res.status(answer.created ? 201 : 200).json(answer);
      },
    }),
    defineRoute({
      method: 'post',
      path: '/watches/:id/batches/from-dataset',
      access: 'watches.manage',
      summary: "Append a dataset of the watch's study as a batch (the column(s) chosen as for an analysis)",
      request: { params: idParamsSchema, body: datasetBatchRequestSchema },
      responses: batchAnswer,
      handler: async ({ params, body, user, res }) => {
        const answer = await appendDatasetBatch(ctx, dataDir, user, params.id, body);
        res.status(answer.created ? 201 : 200).json(answer);
      },
    }),
    defineRoute({
      method: 'get',
      path: '/watches/:id/alerts',
      access: 'watches.read',
      summary: "A watch's alerts, newest first, each with its deliveries (e-mail, webhook) and their status",
      request: { params: idParamsSchema, query: listAlertsQuerySchema },
      responses: { 200: pageSchema(watchAlertSchema) },
      handler: async ({ params, query, user, res }) => {
        res.json(await listAlerts(db, user, params.id, query.page, query.pageSize));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/alerts/:id/acknowledge',
      access: 'alerts.acknowledge',
      tag: 'watches',
      summary: 'Acknowledge an alarm with a note (once)',
      request: { params: idParamsSchema, body: acknowledgeAlertRequestSchema },
      responses: { 200: watchAlertSchema },
      handler: async ({ params, body, user, res }) => {
        res.json(await acknowledgeAlert(db, user, params.id, body.note));
      },
    }),
  ];
}
