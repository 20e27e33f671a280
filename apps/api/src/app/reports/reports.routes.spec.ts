import { createTestApp, type TestContext } from '../../testing/test-app';

describe('report downloads', () => {
  let ctx: TestContext;
  let analysisId: number;
  beforeAll(async () => {
    ctx = await createTestApp();
    const studyId = (await ctx.as('analyst').post('/studies', { name: 'Survey make-up' })).body.id;
    // Invented: 400 survey answers against population shares of 50/30/20 %.
    const created = await ctx.as('analyst').post('/analyses', {
      title: 'Age groups vs population',
      studyId,
      spec: { observed: { labels: ['under 30', '30 to 59', '+60 and over'], counts: [188, 132, 80] }, hypothesis: { kind: 'proportions', values: [0.5, 0.3, 0.2] } },
    });
    analysisId = created.body.id;
  });
  afterAll(() => ctx.close());

  it('serves the Markdown report with title, study, author, engine version, statistics line and cautions', async () => {
    const response = await ctx.as('lead').get(`/analyses/${analysisId}/report.md`);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('text/markdown; charset=utf-8');
    expect(response.headers['content-disposition']).toBe(`attachment; filename="analysis-${analysisId}-age-groups-vs-population.md"`);
    const text = response.text;
    expect(text).toMatch(/^# Age groups vs population\n/);
    expect(text).toContain('- **Study:** Survey make-up');
    expect(text).toContain('- **Run by:** Test analyst');
    expect(text).toMatch(/- \*\*Engine version:\*\* \d+\.\d+\.\d+/);
    expect(text).toContain(`- **In Tallyfit:** <http://localhost:3000/analyses/${analysisId}>`);
    // Expected 200, 120, 80: X² = 144/200 + 144/120 + 0 = 1.92 (hand arithmetic), 2 df.
    expect(text).toContain("- Pearson's chi-square: χ²(2, N = 400) = 1.92");
    expect(text).toContain('## What this does not show');
  });

  it('serves the categories as CSV with a defused formula-like label', async () => {
    const response = await ctx.as('analyst').get(`/analyses/${analysisId}/categories.csv`);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('text/csv; charset=utf-8');
    const lines = response.text.split('\r\n');
    // 188 of 400 = 0.470 against 0.500, expected 200 (hand arithmetic), with the page's digits
    expect(lines[1].startsWith('under 30,188,200.00,0.470,0.500,')).toBe(true);
    expect(lines[3].startsWith("'+60 and over,80,80.00,0.200,0.200,0.00,")).toBe(true);
  });

  it('serves a PDF', async () => {
    const response = await ctx.as('analyst').get(`/analyses/${analysisId}/report.pdf`).buffer(true);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('application/pdf');
    expect(response.body.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });

  it('answers 404 to a viewer outside the study and for an analysis that does not exist', async () => {
    expect((await ctx.as('viewer').get(`/analyses/${analysisId}/report.md`)).status).toBe(404);
    expect((await ctx.as('viewer').get(`/analyses/${analysisId}/report.pdf`)).status).toBe(404);
    expect((await ctx.as('admin').get('/analyses/999999/categories.csv')).status).toBe(404);
  });
});
