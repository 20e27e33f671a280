import type { Response } from 'express';
import type { Knex } from 'knex';
import { idParamsSchema } from '@tallyfit/contracts';
import type { Config } from '../config';
import { HttpError, notFound } from '../http/http-error';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import { categoriesCsv, segmentsCsv } from './categories-csv';
import { markdownReport } from './markdown-report';
import { findPdfFonts, type PdfFonts } from './pdf-fonts';
import { pdfReport } from './pdf-report';
import { analysisLink, downloadName, reportSourceFor } from './reports.service';

function sendFile(res: Response, body: string | Buffer, contentType: string, fileName: string): void {
  res.setHeader('Content-Type', contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.send(body);
}

export function reportsRoutes(db: Knex, config: Config): RouteDefinition[] {
  let fonts: PdfFonts | undefined;
  const pdfFonts = () => {
    try {
      fonts ??= findPdfFonts(config.fontsDir);
      return fonts;
    } catch (error) {
      throw new HttpError(503, 'pdf_unavailable', error instanceof Error ? error.message : 'PDF reports are not available');
    }
  };

  return [
    defineRoute({
      method: 'get',
      path: '/analyses/:id/report.md',
      access: 'analyses.read',
      summary: 'The analysis as a Markdown report: facts, verdict, statistics lines, method, result, table and cautions',
      tag: 'reports',
      request: { params: idParamsSchema },
      responses: { 200: { description: 'the Markdown report', contentType: 'text/markdown' } },
      handler: async ({ params, user, res }) => {
        const source = await reportSourceFor(db, user, params.id);
        sendFile(res, markdownReport(source, analysisLink(config, params.id)), 'text/markdown; charset=utf-8', downloadName(source, 'md'));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/analyses/:id/report.pdf',
      access: 'analyses.read',
      summary: 'The analysis as a PDF report with its tables and a chart of observed against expected counts',
      tag: 'reports',
      request: { params: idParamsSchema },
      responses: { 200: { description: 'the PDF report', contentType: 'application/pdf' } },
      handler: async ({ params, user, res }) => {
        const source = await reportSourceFor(db, user, params.id);
        sendFile(res, await pdfReport(source, pdfFonts()), 'application/pdf', downloadName(source, 'pdf'));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/analyses/:id/categories.csv',
      access: 'analyses.read',
      summary: 'The per-category table as CSV (RFC 4180; labels a spreadsheet would run as formulas are defused)',
      tag: 'reports',
      request: { params: idParamsSchema },
      responses: { 200: { description: 'the categories as CSV', contentType: 'text/csv' } },
      handler: async ({ params, user, res }) => {
        const source = await reportSourceFor(db, user, params.id);
        sendFile(res, categoriesCsv(source.result), 'text/csv; charset=utf-8', downloadName(source, 'csv'));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/analyses/:id/segments.csv',
      access: 'analyses.read',
      summary: 'The ranked segments as CSV: each segment’s N, test, statistic, p, adjusted p, w and flag (404 when the analysis has no segments)',
      tag: 'reports',
      request: { params: idParamsSchema },
      responses: { 200: { description: 'the segments as CSV', contentType: 'text/csv' } },
      handler: async ({ params, user, res }) => {
        const source = await reportSourceFor(db, user, params.id);
        if (!source.segments) throw notFound(`analysis ${params.id} was not split into segments`);
        sendFile(res, segmentsCsv(source.segments.result), 'text/csv; charset=utf-8', downloadName(source, 'segments.csv'));
      },
    }),
  ];
}
