import type { Knex } from 'knex';
import { z } from 'zod';
import {
  analysisChangesSchema,
  analysisRecordSchema,
  analysisSummarySchema,
  createAnalysisRequestSchema,
  idParamsSchema,
  isDatasetAnalysisRequest,
  listAnalysesQuerySchema,
  pageSchema,
  rerunAnalysisRequestSchema,
  rerunAnalysisResponseSchema,
  updateAnalysisRequestSchema,
} from '@tallyfit/contracts';
import type { Config } from '../config';
import type { EngineRunner } from '../engine/engine-runner';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import { listAnalyses, listVersions } from './analyses-history';
import { changesSincePrevious, createAnalysis, deleteAnalysis, getReadableAnalysis, rerunAnalysis, updateAnalysis } from './analyses.service';
import { createAnalysisFromDataset } from './analysis-from-dataset';

export function analysesRoutes(db: Knex, config: Pick<Config, 'dataDir'>, engine: EngineRunner): RouteDefinition[] {
  return [
    defineRoute({
      method: 'post',
      path: '/analyses',
      access: 'analyses.run',
      summary:
        'Run an analysis and store it with its result and engine version: on counts sent in the spec, or on a dataset ' +
        '(datasetId and selection; the chosen column(s) fill the observed counts)',
      request: { body: createAnalysisRequestSchema },
      responses: { 201: analysisRecordSchema },
      handler: ({ body, user }) =>
        isDatasetAnalysisRequest(body)
          ? createAnalysisFromDataset(db, config.dataDir, engine, user, body)
          : createAnalysis(db, engine, user, body),
    }),
    defineRoute({
      method: 'get',
      path: '/analyses',
      access: 'analyses.read',
      summary: 'The history: analyses the caller may read, paginated, sorted and filtered',
      request: { query: listAnalysesQuerySchema },
      responses: { 200: pageSchema(analysisSummarySchema) },
      handler: ({ query, user }) => listAnalyses(db, user, query),
    }),
    defineRoute({
      method: 'get',
      path: '/analyses/:id',
      access: 'analyses.read',
      summary: 'One analysis with its spec and result',
      request: { params: idParamsSchema },
      responses: { 200: analysisRecordSchema },
      handler: ({ params, user }) => getReadableAnalysis(db, user, params.id),
    }),
    defineRoute({
      method: 'patch',
      path: '/analyses/:id',
      access: 'analyses.run',
      summary: 'Edit the title or notes of an analysis',
      request: { params: idParamsSchema, body: updateAnalysisRequestSchema },
      responses: { 200: analysisRecordSchema },
      handler: ({ params, body, user }) => updateAnalysis(db, user, params.id, body),
    }),
    defineRoute({
      method: 'delete',
      path: '/analyses/:id',
      access: 'analyses.run',
      summary: 'Delete an analysis and its versions (its author or an admin); the audit trail keeps the record',
      request: { params: idParamsSchema },
      responses: { 204: { description: 'deleted' } },
      handler: ({ params, user }) => deleteAnalysis(db, user, params.id),
    }),
    defineRoute({
      method: 'post',
      path: '/analyses/:id/rerun',
      access: 'analyses.run',
      summary: 'Run an analysis again as a new version, optionally with a changed spec; reports what changed',
      request: { params: idParamsSchema, body: rerunAnalysisRequestSchema },
      responses: { 201: rerunAnalysisResponseSchema },
      handler: ({ params, body, user }) => rerunAnalysis(db, engine, user, params.id, body.spec),
    }),
    defineRoute({
      method: 'get',
      path: '/analyses/:id/changes',
      access: 'analyses.read',
      summary: 'What this version changed against the version it re-ran (null for a first version)',
      request: { params: idParamsSchema },
      responses: { 200: analysisChangesSchema.nullable() },
      handler: async ({ params, user, res }) => {
        res.json(await changesSincePrevious(db, user, params.id));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/analyses/:id/versions',
      access: 'analyses.read',
      summary: 'Every version of an analysis, oldest first',
      request: { params: idParamsSchema },
      responses: { 200: z.array(analysisSummarySchema) },
      handler: ({ params, user }) => listVersions(db, user, params.id),
    }),
  ];
}
