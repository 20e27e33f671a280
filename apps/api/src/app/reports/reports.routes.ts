import type { Response } from 'express';
import type { Knex } from 'knex';
import { idParamsSchema, type AnalysisRecord, type User } from '@tallyfit/contracts';
import { getReadableAnalysis } from '../analyses/analyses.service';
import type { Config } from '../config';
import { datasetFileName } from '../datasets/datasets.service';
import { HttpError } from '../http/http-error';
import { anyRole, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import { categoriesCsv } from './categories-csv';
import { markdownReport } from './markdown-report';
import { findPdfFonts, type PdfFonts } from './pdf-fonts';
import { pdfReport } from './pdf-report';
import type { ReportSource } from './report-source';

/** The facts a report needs about an analysis the caller may read (404 otherwise). */
export async function reportSourceFor(db: Knex, caller: User, id: number): Promise<ReportSource> {
  const analysis: AnalysisRecord = await getReadableAnalysis(db, caller, id);
  return {
    id: analysis.id,
    title: analysis.title,
    studyId: analysis.study?.id ?? null,
    studyName: analysis.study?.name ?? null,
    datasetName: await datasetFileName(db, analysis.datasetId),
    authorName: analysis.author.name,
    createdAt: analysis.createdAt,
    engineVersion: analysis.engineVersion,
    notes: analysis.notes,
    result: analysis.result,
  };
}

/** The analysis's link in the console, for reports and e-mails. */
export const analysisLink = (config: Pick<Config, 'publicUrl'>, id: number) => `${config.publicUrl}/analyses/${id}`;

/** A download name from the title: letters, digits and dashes only, so no header can be forged. */
export function downloadName(source: Pick<ReportSource, 'id' | 'title'>, extension: string): string {
  const slug = source.title.normalize('NFKD').replace(/[^A-Za-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60).toLowerCase();
  return `analysis-${source.id}${slug ? `-${slug}` : ''}.${extension}`;
}

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
    {
      method: 'get',
      path: '/analyses/:id/report.md',
      access: anyRole,
      summary: 'The analysis as a Markdown report: facts, verdict, statistics lines, method, result, table and cautions',
      tag: 'reports',
      request: { params: idParamsSchema },
      responses: { 200: { description: 'the Markdown report', contentType: 'text/markdown' } },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const source = await reportSourceFor(db, req.user!, id);
        sendFile(res, markdownReport(source, analysisLink(config, id)), 'text/markdown; charset=utf-8', downloadName(source, 'md'));
      },
    },
    {
      method: 'get',
      path: '/analyses/:id/report.pdf',
      access: anyRole,
      summary: 'The analysis as a PDF report with its tables and a chart of observed against expected counts',
      tag: 'reports',
      request: { params: idParamsSchema },
      responses: { 200: { description: 'the PDF report', contentType: 'application/pdf' } },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const source = await reportSourceFor(db, req.user!, id);
        sendFile(res, await pdfReport(source, pdfFonts()), 'application/pdf', downloadName(source, 'pdf'));
      },
    },
    {
      method: 'get',
      path: '/analyses/:id/categories.csv',
      access: anyRole,
      summary: 'The per-category table as CSV (RFC 4180; labels a spreadsheet would run as formulas are defused)',
      tag: 'reports',
      request: { params: idParamsSchema },
      responses: { 200: { description: 'the categories as CSV', contentType: 'text/csv' } },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const source = await reportSourceFor(db, req.user!, id);
        sendFile(res, categoriesCsv(source.result), 'text/csv; charset=utf-8', downloadName(source, 'csv'));
      },
    },
  ];
}
