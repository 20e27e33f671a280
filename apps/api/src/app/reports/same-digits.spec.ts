import { join } from 'node:path';
import { analyze, categoryCells, effectSizeText, ENGINE_VERSION, formatPValueAt, testCells } from '@tallyfit/engine';
import { pdfText, squeeze } from '../../testing/pdf-text';
import { shareMailBody } from '../shares/share-mail';
import { categoriesCsv } from './categories-csv';
import { markdownReport } from './markdown-report';
import { findPdfFonts } from './pdf-fonts';
import { pdfReport } from './pdf-report';
import type { ReportSource } from './report-source';

/**
 * One analysis through every output: the Markdown report, the PDF, the CSV and the share e-mail
 * (the page prints the same `categoryCells`, checked in the console's categories-table spec) must
 * print the same digits. Invented: 1,251 orders across four packing stations expected to share
 * the work equally.
 */
const result = analyze({
  observed: { labels: ['North', 'East', 'South', 'West'], counts: [313, 340, 300, 298] },
  hypothesis: { kind: 'equal' },
  tests: ['pearson', 'g', 'exact'],
});

const source: ReportSource = {
  id: 11,
  title: 'Packing stations, week 50',
  studyId: 2,
  studyName: 'Warehouse balance',
  datasetName: 'stations.csv',
  authorName: 'Ana Analyst',
  createdAt: '2026-12-02T10:15:00.000Z',
  engineVersion: ENGINE_VERSION,
  notes: null,
  result,
  reviewLines: [],
};

describe('every output prints the same digits', () => {
  const cells = categoryCells(result);
  const north = cells[0];

  it('chooses digits that show the departure (hand arithmetic)', () => {
    // 1,251 / 4 = 312.75 expected per station; North 313 / 1,251 = 0.25020, which three decimals
    // would print as 0.250 beside an expected 0.250 (common practice, no source: enough digits to show a difference).
    expect(north.expected).toBe('312.75');
    expect(north.share).toBe('0.2502');
    expect(north.expectedShare).toBe('0.2500');
    // both ends of every interval with the share's four decimals
    for (const row of cells) {
      expect(row.intervalLow).toMatch(/^0\.\d{4}$/);
      expect(row.intervalHigh).toMatch(/^0\.\d{4}$/);
    }
  });

  async function outputs() {
    const markdown = markdownReport(source, 'http://localhost:3000/analyses/11');
    const fonts = findPdfFonts(join(__dirname, '../../../../../fonts'));
    const pdf = squeeze(pdfText(await pdfReport(source, fonts, { compress: false })));
    const csv = categoriesCsv(result);
    const mail = shareMailBody({ name: 'Ana Analyst' }, source.title, 'http://localhost:3000/analyses/11', markdown);
    return { markdown, pdf, csv, text: mail.text, html: mail.html };
  }

  it('prints each category the same way in Markdown, PDF, CSV and both e-mail parts', async () => {
    const printed = await outputs();
    for (const row of cells) {
      const shown = [row.observed, row.expected, row.share, row.expectedShare, row.gap, row.p, row.intervalLow, row.intervalHigh];
      for (const [output, text] of Object.entries(printed)) {
        // the CSV writes the ASCII minus so spreadsheets read numbers; the documents a typeset one
        const haystack = output === 'csv' ? text.replace(/-/g, '−') : output === 'pdf' ? text : text.replace(/&lt;/g, '<').replace(/&gt;/g, '>');
        for (const value of shown) {
          const needle = output === 'pdf' ? squeeze(value) : value;
          expect({ output, category: row.label, value, found: haystack.includes(needle) }).toEqual({ output, category: row.label, value, found: true });
        }
      }
    }
  });

  it('prints every test with the same p and the PDF says how each was computed', async () => {
    const printed = await outputs();
    const tests = testCells(result);
    expect(tests.map((test) => test.key)).toEqual(['pearson', 'g', 'exact']);
    for (const test of tests) {
      expect(test.p).toBe(formatPValueAt(result.tests[test.key]!.p, result.conclusion.alpha));
      expect(test.how).not.toBe('');
      expect(printed.pdf).toContain(squeeze(test.how));
      expect(printed.markdown).toContain(`| ${test.p} | ${test.how} |`);
    }
    expect(printed.pdf).toContain(squeeze(`Cohen's ${effectSizeText(result)}`));
    expect(printed.markdown).toContain(`Cohen's ${effectSizeText(result)}`);
  });
});
