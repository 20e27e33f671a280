import type { AnalysisResult, SegmentsResult } from '@tallyfit/engine';

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

const number = (value: number) => (Number.isFinite(value) ? String(value) : '');

/** The per-category table as CSV with CRLF line ends and a header row. */
export function categoriesCsv(result: AnalysisResult): string {
  const header = [
    'category',
    'observed',
    'expected',
    'observed share',
    'expected share',
    'residual',
    'adjusted residual',
    'p',
    'adjusted p',
    'interval low',
    'interval high',
  ];
  const rows = result.categories.map((row) => [
    field(guardFormula(row.label)),
    number(row.observed),
    number(row.expected),
    number(row.share),
    number(row.expectedShare),
    number(row.residual),
    number(row.adjustedResidual),
    number(row.p),
    number(row.pAdjusted),
    number(row.interval.low),
    number(row.interval.high),
  ]);
  return [header, ...rows].map((cells) => cells.join(',')).join('\r\n') + '\r\n';
}

/** The ranked segments as CSV, one row per segment, empty cells where a segment was not tested. */
export function segmentsCsv(segments: SegmentsResult): string {
  const header = ['rank', 'segment', 'n', 'test', 'statistic', 'df', 'p', 'adjusted p', 'adjustment', 'w', 'driven by', 'flag'];
  const optional = (value: number | undefined) => (value === undefined ? '' : number(value));
  const rows = segments.rows.map((row) => [
    optional(row.rank),
    field(guardFormula(row.segment)),
    number(row.n),
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
