import { join } from 'node:path';
import { analyze, ENGINE_VERSION } from '@tallyfit/engine';
import { pdfText, squeeze } from '../../testing/pdf-text';
import { categoriesCsv } from './categories-csv';
import { markdownReport } from './markdown-report';
import { findPdfFonts } from './pdf-fonts';
import { pdfReport } from './pdf-report';
import type { ReportSource } from './report-source';

// An invented scenario: a ten-way traffic split where one arm's label would be a formula in a spreadsheet.
const result = analyze({
  observed: {
    labels: ['=SUM(A1)', 'Ärm "B", north', 'C', 'D', 'E', 'F', 'G', 'H', 'I', 'J'],
    counts: [52, 48, 50, 61, 39, 50, 47, 53, 55, 45],
  },
  hypothesis: { kind: 'equal' },
  tests: ['pearson', 'g'],
});

const source: ReportSource = {
  id: 7,
  title: 'Checkout split, week 48',
  studyId: 3,
  studyName: 'Checkout redesign',
  datasetName: 'assignments.csv',
  authorName: 'Ana Analyst',
  createdAt: '2026-12-02T10:15:00.000Z',
  engineVersion: ENGINE_VERSION,
  notes: 'Traffic from the mobile app only.',
  reviewLines: ['Review state: Signed off.', 'Signed off by Lee Lead on 2026-12-02 11:40 UTC.'],
  result,
};

describe('reports of an analysis', () => {
  it('writes Markdown with the facts, verdict, statistics lines, table and cautions', () => {
    const markdown = markdownReport(source, 'http://localhost:3000/analyses/7');
    expect(markdown).toMatch(/^# Checkout split, week 48\n/);
    expect(markdown).toContain('- **Study:** Checkout redesign');
    expect(markdown).toContain('- **Run by:** Ana Analyst');
    expect(markdown).toContain(`- **Engine version:** ${ENGINE_VERSION}`);
    expect(markdown).toContain('- **In Tallyfit:** <http://localhost:3000/analyses/7>');
    expect(markdown).toContain(result.conclusion.verdict);
    // X² = Σ (O − E)² / E with E = 50: (4 + 4 + 0 + 121 + 121 + 0 + 9 + 9 + 25 + 25) / 50 = 6.36 (hand arithmetic).
    expect(markdown).toContain("- Pearson's chi-square: χ²(9, N = 500) = 6.36");
    expect(markdown).toContain('- G-test (likelihood ratio): G(9, N = 500)');
    expect(markdown).toContain('Traffic from the mobile app only.');
    expect(markdown).toContain('## Review\n\n- Review state: Signed off.\n- Signed off by Lee Lead on 2026-12-02 11:40 UTC.\n');
    expect(markdown).toContain('| \\=SUM(A1) |'.replace('\\', ''));
    for (const caution of result.report.cautions) expect(markdown).toContain(`- ${caution}`);
  });

  it('escapes Markdown characters in the title', () => {
    expect(markdownReport({ ...source, title: 'Split *A* | [B]' })).toMatch(/^# Split \\\*A\\\* \\\| \\\[B\\\]\n/);
  });

  it('writes the categories as RFC 4180 CSV and defuses a formula in a label', () => {
    const lines = categoriesCsv(result).split('\r\n');
    expect(lines[0]).toBe(
      'Category,Counted,Expected,Share counted,Share expected,Gap in standard errors,Gap per √expected,p (Holm),"95% range, low","95% range, high"',
    );
    // 52 of 500 = 0.104 against 0.1 (hand arithmetic); the page's digits, numbers a spreadsheet reads
    expect(lines[1].startsWith("'=SUM(A1),52,50.00,0.104,0.100,")).toBe(true);
    expect(lines[2].startsWith('"Ärm ""B"", north",48,50.00,')).toBe(true);
    expect(lines).toHaveLength(12);
    expect(lines[11]).toBe('');
  });

  it('renders a PDF with the statistics line, both tables, the chart legend and the cautions', async () => {
    const fonts = findPdfFonts(join(__dirname, '../../../../../fonts'));
    const pdf = await pdfReport(source, fonts, { compress: false });
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.subarray(-6).toString('latin1')).toMatch(/%%EOF/);
    const text = squeeze(pdfText(pdf));
    for (const expected of [
      'Checkout split, week 48',
      'Study: Checkout redesign',
      `Engine version: ${ENGINE_VERSION}`,
      'Review state: Signed off.',
      'Signed off by Lee Lead on 2026-12-02 11:40 UTC.',
      "Pearson's chi-square: χ²(9, N = 500) = 6.36, p = .703",
      'G-test (likelihood ratio): G(9, N = 500) = 6.40',
      'Observed and expected counts',
      'ObservedExpected',
      'Ärm "B", north',
      'Gap in standard errors',
      'How computed',
      'Chi-square distribution with 9 degrees of freedom.',
      'What this does not show',
      ...result.report.cautions,
    ]) {
      expect({ expected, found: text.includes(squeeze(expected)) }).toEqual({ expected, found: true });
    }
  });

  it('draws the bars as filled vector rectangles, one observed and one expected per category', async () => {
    const fonts = findPdfFonts(join(__dirname, '../../../../../fonts'));
    const pdf = (await pdfReport(source, fonts, { compress: false })).toString('latin1');
    const bars = pdf.match(/ re\n/g) ?? [];
    // 20 bars and the 2 legend swatches.
    expect(bars.length).toBe(22);
  });

  it('continues tables on new pages for many categories and draws every bar', async () => {
    // Invented: 60 shelf positions counted in a stock check, against equal shares.
    const labels = Array.from({ length: 60 }, (_, i) => `shelf ${i + 1}`);
    const many = analyze({ observed: { labels, counts: labels.map((_, i) => 40 + (i % 7)) }, hypothesis: { kind: 'equal' }, tests: ['pearson'] });
    const fonts = findPdfFonts(join(__dirname, '../../../../../fonts'));
    const pdf = await pdfReport({ ...source, result: many }, fonts, { compress: false });
    const raw = pdf.toString('latin1');
    expect((raw.match(/\/Type \/Page\b/g) ?? []).length).toBeGreaterThanOrEqual(3);
    expect(raw.match(/ re\n/g)?.length).toBe(2 * 60 + 2);
    const text = squeeze(pdfText(pdf));
    expect(text).toContain(squeeze('shelf 60'));
    expect(text).toContain(squeeze('What this does not show'));
  });
});
