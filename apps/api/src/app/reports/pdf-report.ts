import PDFDocument from 'pdfkit';
import {
  categoryCells,
  categoryHeadings,
  effectSizeText,
  formatExpectedCount,
  formatPValue,
  formatShare,
  formatStatistic,
  groupDigits,
  testCells,
  type SegmentsResult,
} from '@tallyfit/engine';
import { drawObservedExpectedChart } from './pdf-bar-chart';
import type { PdfFonts } from './pdf-fonts';
import { drawTable } from './pdf-table';
import { MUTED, PdfText } from './pdf-text';
import { reportFacts, statisticsLines, type ReportSource } from './report-source';

export interface PdfOptions {
  /** compress page content (on for delivery; tests turn it off to read the text) */
  compress?: boolean;
}

/**
 * The analysis as a PDF: title and facts, the verdict, every test's statistics line, a table of
 * the tests, a chart of observed against expected counts, the table of categories, the method and
 * result sentences, and what the test does not show.
 */
export function pdfReport(source: ReportSource, fonts: PdfFonts, options: PdfOptions = {}): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margins: { top: 56, bottom: 56, left: 56, right: 56 },
    compress: options.compress ?? true,
    info: { Title: source.title, Author: source.authorName, Creator: `Tallyfit (engine ${source.engineVersion})` },
  });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  writeReport(new PdfText(doc, fonts), source);
  doc.end();
  return done;
}

function writeReport(text: PdfText, source: ReportSource): void {
  const { doc } = text;
  const { result } = source;

  text.paragraph(source.title, { size: 18, weight: 700 });
  doc.moveDown(0.3);
  text.paragraph(reportFacts(source).map(([label, value]) => `${label}: ${value}`).join('   ·   '), { size: 8.5, color: MUTED });
  doc.moveDown(0.5);
  for (const line of source.reviewLines) text.paragraph(line, { size: 9.5 });
  doc.moveDown(0.5);
  text.paragraph(result.conclusion.verdict, { size: 11 });

  text.heading('Statistics');
  for (const [test, line] of statisticsLines(result)) text.paragraph(`${test}: ${line}`, { size: 10 });

  text.heading('Tests');
  drawTable(
    text,
    [
      { title: 'Test', share: 2.4 },
      { title: 'Statistic', share: 1.1, align: 'right' },
      { title: 'df', share: 0.6, align: 'right' },
      { title: 'p', share: 1, align: 'right' },
      { title: 'How computed', share: 3.4 },
    ],
    testCells(result).map((test) => [test.name, test.statistic, test.df, test.p, test.how]),
  );
  text.paragraph(
    `Effect size: Cohen's ${effectSizeText(result)}. Smallest expected count: ${formatExpectedCount(result.assumptions.minExpected)}.`,
    { size: 9.5 },
  );

  text.heading('Observed and expected counts');
  drawObservedExpectedChart(
    text,
    result.categories.map((row) => ({ label: row.label, observed: row.observed, expected: row.expected })),
  );

  text.heading('Categories');
  const headings = categoryHeadings(result);
  drawTable(
    text,
    [
      { title: headings.label, share: 2.2 },
      { title: headings.observed, share: 1.1, align: 'right' },
      { title: headings.expected, share: 1.2, align: 'right' },
      { title: headings.share, share: 1.1, align: 'right' },
      { title: headings.expectedShare, share: 1.1, align: 'right' },
      { title: headings.gap, share: 1.3, align: 'right' },
      { title: headings.p, share: 1, align: 'right' },
      { title: headings.intervalLow.replace(/, low$/, ''), share: 1.7, align: 'right' },
    ],
    categoryCells(result).map((cells) => [
      cells.label,
      cells.observed,
      cells.expected,
      cells.share,
      cells.expectedShare,
      cells.gap,
      cells.p,
      `${cells.intervalLow} – ${cells.intervalHigh}`,
    ]),
  );

  if (source.segments) writeSegments(text, source.segments.column, source.segments.result);

  text.heading('Method');
  text.paragraph(result.report.methods, { size: 9.5 });
  text.heading('Result');
  text.paragraph(result.report.results, { size: 9.5 });
  if (source.notes?.trim()) {
    text.heading('Notes');
    text.paragraph(source.notes.trim(), { size: 9.5 });
  }
  if (result.warnings.length) {
    text.heading('Warnings from the engine');
    for (const warning of result.warnings) text.paragraph(`•  ${warning.message}`, { size: 9.5 }, { indent: 8 });
  }
  text.heading('What this does not show');
  for (const caution of result.report.cautions) {
    text.paragraph(`•  ${caution}`, { size: 9.5 }, { indent: 8 });
    doc.moveDown(0.2);
  }
}

/** The segments: the write-up paragraph, then the ranked table (flags as the last column). */
function writeSegments(text: PdfText, column: string, segments: SegmentsResult): void {
  text.heading(`Segments by ${column}`);
  text.paragraph(segments.report.paragraph, { size: 9.5 });
  drawTable(
    text,
    [
      { title: 'Rank', share: 0.6, align: 'right' },
      { title: 'Segment', share: 2.2 },
      { title: 'N', share: 1.1, align: 'right' },
      { title: 'Statistic', share: 1.1, align: 'right' },
      { title: 'p', share: 1, align: 'right' },
      { title: 'Adjusted p', share: 1.2, align: 'right' },
      { title: 'w', share: 0.8, align: 'right' },
      { title: 'Note', share: 2.4 },
    ],
    segments.rows.map((row) => [
      row.rank === undefined ? '—' : String(row.rank),
      row.segment,
      // The same formatters as the engine's segments table in the Markdown report.
      groupDigits(row.n),
      row.statistic === undefined ? '—' : formatStatistic(row.statistic),
      row.p === undefined ? '—' : formatPValue(row.p),
      row.pAdjusted === undefined ? '—' : formatPValue(row.pAdjusted),
      row.w === undefined ? '—' : formatShare(row.w),
      row.flag ? (row.flag.code === 'too-small' ? 'too small for chi-square' : 'not tested') : row.significant ? 'departs' : '',
    ]),
  );
}
