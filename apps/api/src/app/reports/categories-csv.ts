import { categoryCells, categoryHeadings, type AnalysisResult, type SegmentsResult } from '@tallyfit/engine';

/**
 * A label that a spreadsheet would run as a formula (it starts with = + - @, or a tab or carriage
 * return) is written with a leading apostrophe, which spreadsheets show as text (OWASP's advice on
 * CSV injection). Numbers are written by us, never by the uploader, so they are left as numbers.
 */
function guardFormula(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** RFC 4180: a field holding a comma, quote or line break is quoted, and quotes inside are doubled. */
function field(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The shared cells as a spreadsheet reads numbers: the ASCII minus, no thousands separators. */
const number = (text: string) => text.replace(/^−/, '-').replace(/,/g, '');

/**
 * The per-category table as CSV with CRLF line ends and a header row: the same headings and digits
 * as the page and the other reports (the engine's shared cells).
 */
export function categoriesCsv(result: AnalysisResult): string {
  const headings = categoryHeadings(result);
  const header = [
    headings.label,
    headings.observed,
    headings.expected,
    headings.share,
    headings.expectedShare,
    headings.gap,
    headings.residual,
    headings.p,
    headings.intervalLow,
    headings.intervalHigh,
  ].map(field);
  const rows = categoryCells(result).map((cells) => [
    field(guardFormula(cells.label)),
    number(cells.observed),
    number(cells.expected),
    number(cells.share),
    number(cells.expectedShare),
    number(cells.gap),
    number(cells.residual),
    field(cells.p),
    number(cells.intervalLow),
    number(cells.intervalHigh),
  ]);
  return [header, ...rows].map((cells) => cells.join(',')).join('\r\n') + '\r\n';
}

/** The ranked segments as CSV, one row per segment, empty cells where a segment was not tested. */
export function segmentsCsv(segments: SegmentsResult): string {
  const header = ['rank', 'segment', 'n', 'test', 'statistic', 'df', 'p', 'adjusted p', 'adjustment', 'w', 'driven by', 'flag'];
  // Raw numbers in full precision: a spreadsheet formats them itself.
  const optional = (value: number | undefined) => (value === undefined ? '' : String(value));
  const rows = segments.rows.map((row) => [
    optional(row.rank),
    field(guardFormula(row.segment)),
    String(row.n),
    row.test ?? '',
    optional(row.statistic),
    optional(row.df),
    optional(row.p),
    optional(row.pAdjusted),
    segments.adjust,
    optional(row.w),
    field(guardFormula(row.drivers.map((driver) => `${driver.direction} ${driver.label}`).join('; '))),
    field(row.flag?.message ?? ''),
  ]);
  return [header, ...rows].map((cells) => cells.join(',')).join('\r\n') + '\r\n';
}
