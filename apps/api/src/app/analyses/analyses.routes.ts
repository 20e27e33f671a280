import type { Knex } from 'knex';
import { z } from 'zod';
import { createAnalysisRequestSchema } from '@tallyfit/contracts';
import { notFound } from '../http/http-error';
import { anyRole, rolesAccess, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import { createAnalysis, getAnalysis, listOwnAnalyses } from './analyses.service';

const idParams = z.object({ id: z.coerce.number().int().positive({ message: 'id must be a positive whole number' }) });

export function analysesRoutes(db: Knex): RouteDefinition[] {
  return [
    {
      method: 'post',
      path: '/analyses',
      access: rolesAccess('admin', 'analyst'),
      summary: 'Run an analysis and store it with its result and engine version',
      handler: async (req, res) => {
        const request = parseInput(createAnalysisRequestSchema, req.body, 'analysis');
        res.status(201).json(await createAnalysis(db, req.user!, request));
      },
    },
    {
      method: 'get',
      path: '/analyses',
      access: anyRole,
      summary: "The caller's analyses, newest first",
      handler: async (req, res) => {
        res.json(await listOwnAnalyses(db, req.user!));
      },
    },
    {
      method: 'get',
      path: '/analyses/:id',
      access: anyRole,
      summary: 'One analysis with its spec and result',
      handler: async (req, res) => {
        const { id } = parseInput(idParams, req.params, 'path');
        const analysis = await getAnalysis(db, id);
        // Until studies share work, an analysis is visible to its author and to those who review everyone's.
        const mayRead = analysis.author.id === req.user!.id || ['admin', 'lead'].includes(req.user!.role);
        if (!mayRead) throw notFound(`analysis ${id} does not exist`);
        res.json(analysis);
      },
    },
  ];
}
