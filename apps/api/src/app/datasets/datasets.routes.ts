import { join } from 'node:path';
import type { RequestHandler } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import {
  categoryCountsSchema,
  countSelectionSchema,
  datasetRecordSchema,
  datasetSummarySchema,
  datasetUploadFieldsSchema,
  idParamsSchema,
  idText,
} from '@tallyfit/contracts';
import type { Config } from '../config';
import { defineRoute, parsedParams, type RouteDefinition } from '../http/route-table';
import { requireStudyContributor } from '../studies/studies.service';
import { chooseCounts, createDataset, deleteDataset, getReadableDataset, listDatasets } from './datasets.service';
import { fileKindOf } from './file-kind';
import { receiveDatasetFile } from './upload-middleware';

const studyParams = z.object({ studyId: idText('studyId') });

export function datasetsRoutes(db: Knex, config: Config): RouteDefinition[] {
  // Checked before the upload is received, so a file for a study the caller cannot add to is not taken in.
  const studyOpenToCaller: RequestHandler = (req, _res, next) => {
    const { studyId } = parsedParams<z.infer<typeof studyParams>>(req);
    requireStudyContributor(db, req.user!, studyId).then(() => next(), next);
  };

  return [
    defineRoute({
      method: 'post',
      path: '/studies/:studyId/datasets',
      access: 'datasets.add',
      summary:
        'Upload a CSV, TSV or XLSX file (multipart field "file"; optional fields shape, column, labelColumn, countColumn choose the counts)',
      tag: 'datasets',
      request: { params: studyParams, body: datasetUploadFieldsSchema, bodyContentType: 'multipart/form-data' },
      responses: { 201: datasetRecordSchema },
      before: [studyOpenToCaller, receiveDatasetFile(join(config.dataDir, 'uploads-in-progress'), config.uploadLimitBytes)],
      handler: ({ params, body, user, req }) => {
        // The upload middleware has received a file of a kind we read.
        const file = req.file!;
        const kind = fileKindOf(file.originalname)!;
        const upload = { path: file.path, originalName: file.originalname, sizeBytes: file.size, kind };
        return createDataset(db, config.dataDir, user, params.studyId, upload, body);
      },
    }),
    defineRoute({
      method: 'get',
      path: '/studies/:studyId/datasets',
      access: 'datasets.read',
      summary: 'The datasets of a study, newest first',
      tag: 'datasets',
      request: { params: studyParams },
      responses: { 200: z.array(datasetSummarySchema) },
      handler: ({ params, user }) => listDatasets(db, user, params.studyId),
    }),
    defineRoute({
      method: 'get',
      path: '/datasets/:id',
      access: 'datasets.read',
      summary: 'One dataset with its columns, preview, offered counts and chosen counts',
      request: { params: idParamsSchema },
      responses: { 200: datasetRecordSchema },
      handler: ({ params, user }) => getReadableDataset(db, user, params.id),
    }),
    defineRoute({
      method: 'post',
      path: '/datasets/:id/columns',
      access: 'datasets.add',
      summary: 'Choose the column(s) that hold the categories; answers and keeps their counts',
      request: { params: idParamsSchema, body: countSelectionSchema },
      responses: { 200: categoryCountsSchema },
      handler: ({ params, body, user }) => chooseCounts(db, config.dataDir, user, params.id, body),
    }),
    defineRoute({
      method: 'delete',
      path: '/datasets/:id',
      access: 'datasets.add',
      summary: 'Delete a dataset (its uploader or an admin); analyses that used it keep its name',
      request: { params: idParamsSchema },
      responses: { 204: { description: 'deleted' } },
      handler: ({ params, user }) => deleteDataset(db, config.dataDir, user, params.id),
    }),
  ];
}
