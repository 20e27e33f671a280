import type { Knex } from 'knex';
import { z } from 'zod';
import {
  analysisRecordSchema,
  analysisSummarySchema,
  createAnalysisRequestSchema,
  idParamsSchema,
  listAnalysesQuerySchema,
  pageSchema,
  rerunAnalysisRequestSchema,
  rerunAnalysisResponseSchema,
  updateAnalysisRequestSchema,
} from '@tallyfit/contracts';
import type { EngineRunner } from '../engine/engine-runner';
import { anyRole, rolesAccess, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import {
  createAnalysis,
  deleteAnalysis,
  getReadableAnalysis,
  listAnalyses,
  listVersions,
  rerunAnalysis,
  updateAnalysis,
} from './analyses.service';

/** Those who run analyses; finer rules (author, study role) are checked in the service. */
const runners = rolesAccess('admin', 'analyst');

export function analysesRoutes(db: Knex, engine: EngineRunner): RouteDefinition[] {
  return [
    {
      method: 'post',
      path: '/analyses',
      access: runners,
      summary: 'Run an analysis on inline counts and store it with its result and engine version',
      request: { body: createAnalysisRequestSchema },
      responses: { 201: analysisRecordSchema },
      handler: async (req, res) => {
        const body = parseInput(createAnalysisRequestSchema, req.body, 'analysis');
        res.status(201).json(await createAnalysis(db, engine, req.user!, body));
      },
    },
    {
      method: 'get',
      path: '/analyses',
      access: anyRole,
      summary: 'The history: analyses the caller may read, paginated, sorted and filtered',
      request: { query: listAnalysesQuerySchema },
      responses: { 200: pageSchema(analysisSummarySchema) },
      handler: async (req, res) => {
        const query = parseInput(listAnalysesQuerySchema, req.query, 'query');
        res.json(await listAnalyses(db, req.user!, query));
      },
    },
    {
      method: 'get',
      path: '/analyses/:id',
      access: anyRole,
      summary: 'One analysis with its spec and result',
      request: { params: idParamsSchema },
      responses: { 200: analysisRecordSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        res.json(await getReadableAnalysis(db, req.user!, id));
      },
    },
    {
      method: 'patch',
      path: '/analyses/:id',
      access: runners,
      summary: 'Edit the title or notes of an analysis',
      request: { params: idParamsSchema, body: updateAnalysisRequestSchema },
      responses: { 200: analysisRecordSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const body = parseInput(updateAnalysisRequestSchema, req.body, 'analysis change');
        res.json(await updateAnalysis(db, req.user!, id, body));
      },
    },
    {
      method: 'delete',
      path: '/analyses/:id',
      access: runners,
      summary: 'Delete an analysis and its versions (its author or an admin); the audit trail keeps the record',
      request: { params: idParamsSchema },
      responses: { 204: { description: 'deleted' } },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        await deleteAnalysis(db, req.user!, id);
        res.status(204).end();
      },
    },
    {
      method: 'post',
      path: '/analyses/:id/rerun',
      access: runners,
      summary: 'Run an analysis again as a new version, optionally with a changed spec; reports what changed',
      request: { params: idParamsSchema, body: rerunAnalysisRequestSchema },
      responses: { 201: rerunAnalysisResponseSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const body = parseInput(rerunAnalysisRequestSchema, req.body ?? {}, 're-run');
        res.status(201).json(await rerunAnalysis(db, engine, req.user!, id, body.spec));
      },
    },
    {
      method: 'get',
      path: '/analyses/:id/versions',
      access: anyRole,
      summary: 'Every version of an analysis, oldest first',
      request: { params: idParamsSchema },
      responses: { 200: z.array(analysisSummarySchema) },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        res.json(await listVersions(db, req.user!, id));
      },
    },
  ];
}
