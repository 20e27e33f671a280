import { rmSync } from 'node:fs';
import { join } from 'node:path';
import type { RequestHandler } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import {
  analysisRecordSchema,
  categoryCountsSchema,
  countSelectionSchema,
  datasetAnalysisRequestSchema,
  datasetRecordSchema,
  datasetSummarySchema,
  idParamsSchema,
  type CountSelection,
} from '@tallyfit/contracts';
import { analysisSpecSchema } from '@tallyfit/engine';
import { createAnalysis } from '../analyses/analyses.service';
import type { Config } from '../config';
import type { EngineRunner } from '../engine/engine-runner';
import { badRequest } from '../http/http-error';
import { anyRole, rolesAccess, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import { requireStudyContributor } from '../studies/studies.service';
import {
  chooseCounts,
  countsForSelection,
  createDataset,
  deleteDataset,
  getReadableDataset,
  listDatasets,
} from './datasets.service';
import { fileKindOf } from './file-kind';
import { receiveDatasetFile, unsupportedFileType } from './upload-middleware';

const studyParams = z.object({
  studyId: z.coerce.number().int().positive({ message: 'studyId must be a positive whole number' }),
});

/** Those who add work to studies; membership and study role are checked in the service. */
const contributors = rolesAccess('admin', 'analyst');

/** The optional column choice sent as multipart fields beside the file. */
function selectionFromFields(fields: Record<string, unknown> | undefined): CountSelection | undefined {
  if (!fields || fields['shape'] === undefined || fields['shape'] === '') return undefined;
  return parseInput(countSelectionSchema, fields, 'column choice');
}

export function datasetsRoutes(db: Knex, config: Config, engine: EngineRunner): RouteDefinition[] {
  // Checked before the upload is received, so a file for a study the caller cannot add to is not taken in.
  const studyOpenToCaller: RequestHandler = (req, _res, next) => {
    const { studyId } = parseInput(studyParams, req.params, 'path');
    requireStudyContributor(db, req.user!, studyId).then(() => next(), next);
  };

  return [
    {
      method: 'post',
      path: '/studies/:studyId/datasets',
      access: contributors,
      summary:
        'Upload a CSV, TSV or XLSX file (multipart field "file"; optional fields shape, column, labelColumn, countColumn choose the counts)',
      tag: 'datasets',
      request: { params: studyParams },
      responses: { 201: datasetRecordSchema },
      before: [studyOpenToCaller, receiveDatasetFile(join(config.dataDir, 'uploads-in-progress'), config.uploadLimitBytes)],
      handler: async (req, res) => {
        const file = req.file;
        try {
          const { studyId } = parseInput(studyParams, req.params, 'path');
          if (!file) throw badRequest('send the dataset in the multipart field named "file"', [{ path: 'file', message: 'a file is required' }]);
          const kind = fileKindOf(file.originalname);
          if (!kind) throw unsupportedFileType(file.originalname);
          const selection = selectionFromFields(req.body as Record<string, unknown> | undefined);
          const dataset = await createDataset(
            db,
            config.dataDir,
            req.user!,
            studyId,
            { path: file.path, originalName: file.originalname, sizeBytes: file.size, kind },
            selection,
          );
          res.status(201).json(dataset);
        } finally {
          if (file) rmSync(file.path, { force: true });
        }
      },
    },
    {
      method: 'get',
      path: '/studies/:studyId/datasets',
      access: anyRole,
      summary: 'The datasets of a study, newest first',
      tag: 'datasets',
      request: { params: studyParams },
      responses: { 200: z.array(datasetSummarySchema) },
      handler: async (req, res) => {
        const { studyId } = parseInput(studyParams, req.params, 'path');
        res.json(await listDatasets(db, req.user!, studyId));
      },
    },
    {
      method: 'get',
      path: '/datasets/:id',
      access: anyRole,
      summary: 'One dataset with its columns, preview, offered counts and chosen counts',
      request: { params: idParamsSchema },
      responses: { 200: datasetRecordSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        res.json(await getReadableDataset(db, req.user!, id));
      },
    },
    {
      method: 'post',
      path: '/datasets/:id/columns',
      access: contributors,
      summary: 'Choose the column(s) that hold the categories; answers and keeps their counts',
      request: { params: idParamsSchema, body: countSelectionSchema },
      responses: { 200: categoryCountsSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const selection = parseInput(countSelectionSchema, req.body, 'column choice');
        res.json(await chooseCounts(db, config.dataDir, req.user!, id, selection));
      },
    },
    {
      method: 'delete',
      path: '/datasets/:id',
      access: contributors,
      summary: 'Delete a dataset (its uploader or an admin); analyses that used it keep its name',
      request: { params: idParamsSchema },
      responses: { 204: { description: 'deleted' } },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        await deleteDataset(db, config.dataDir, req.user!, id);
        res.status(204).end();
      },
    },
    {
      method: 'post',
      path: '/datasets/:id/analyses',
      access: contributors,
      summary: "Run an analysis on a dataset's counts: the chosen column(s) fill the spec's observed counts",
      tag: 'analyses',
      request: { params: idParamsSchema, body: datasetAnalysisRequestSchema },
      responses: { 201: analysisRecordSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const body = parseInput(datasetAnalysisRequestSchema, req.body, 'analysis');
        const { dataset, counts } = await countsForSelection(db, config.dataDir, req.user!, id, body.selection);
        const spec = parseInput(analysisSpecSchema, { ...body.spec, observed: { labels: counts.labels, counts: counts.counts } }, 'analysis');
        const analysis = await createAnalysis(db, engine, req.user!, {
          title: body.title,
          notes: body.notes,
          spec,
          studyId: dataset.studyId,
          datasetId: dataset.id,
        });
        res.status(201).json(analysis);
      },
    },
  ];
}
