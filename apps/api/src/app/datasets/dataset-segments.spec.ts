import { createTestApp, type TestContext } from '../../testing/test-app';

/**
 * An analysis of a dataset split by a second column: counted in one pass, every segment tested,
 * stored with the analysis, listed in the history and written into the reports.
 */
describe('analyses of a dataset with segments', () => {
  jest.setTimeout(120_000);
  let ctx: TestContext;
  let datasetId: number;
  beforeAll(async () => {
    ctx = await createTestApp();
    const studyId = (await ctx.as('analyst').post('/studies', { name: 'Checkout split by device' })).body.id;
    // Desktop: McDonald, Handbook of Biological Statistics, 3rd ed. (2014): 1752 vs 1895 under 1:1, X² = 5.6071, p = 0.0179.
    // Tablet: invented, an even 50 / 50 (X² = 0, p = 1 by hand). Two rows without a device are left out of the segments.
    const rows = [
      ...Array.from({ length: 1752 }, (_, i) => `${i},control,desktop`),
      ...Array.from({ length: 1895 }, (_, i) => `${i},variant,desktop`),
      ...Array.from({ length: 50 }, (_, i) => `${i},control,tablet`),
      ...Array.from({ length: 50 }, (_, i) => `${i},variant,tablet`),
      '1,control,',
      '2,variant,',
    ];
    const upload = await ctx
      .as('analyst')
      .post(`/studies/${studyId}/datasets`)
      .attach('file', Buffer.from(['visitor,variant,device', ...rows].join('\n')), 'visits.csv');
    datasetId = upload.body.id;
  });
  afterAll(() => ctx.close());

  const request = () => ({
    title: 'Split by device',
    datasetId,
    selection: { shape: 'raw' as const, column: 'variant' },
    spec: { hypothesis: { kind: 'equal' as const } },
    segmentColumn: 'device',
  });

  it('stores the ranked segments, lists the split in the history, and writes it into the reports', async () => {
    const created = await ctx.as('analyst').post('/analyses', request());
    expect(created.status).toBe(201);
    const analysis = (await ctx.as('analyst').get(`/analyses/${created.body.id}`)).body;
    expect(analysis.segmentColumn).toBe('device');
    expect(analysis.result.n).toBe(3749);
    const segments = analysis.segments;
    expect(segments.adjust).toBe('holm');
    expect(segments.rows.map((row: { segment: string; n: number; rank: number }) => [row.segment, row.n, row.rank])).toEqual([
      ['desktop', 3647, 1],
      ['tablet', 100, 2],
    ]);
    expect(segments.rows[0].p).toBeCloseTo(0.0179, 4);
    // Holm with two segments: the smaller p doubled.
    expect(segments.rows[0].pAdjusted).toBeCloseTo(2 * segments.rows[0].p, 12);
    expect(segments.rows[1].p).toBeCloseTo(1, 12);

    const history = await ctx.as('analyst').get('/analyses');
    expect(history.body.items[0]).toMatchObject({ id: analysis.id, segmentColumn: 'device' });

    const markdown = await ctx.as('analyst').get(`/analyses/${analysis.id}/report.md`);
    expect(markdown.text).toContain('## Segments by device');
    expect(markdown.text).toContain('| 1 | desktop | 3,647 |');
    const csv = await ctx.as('analyst').get(`/analyses/${analysis.id}/segments.csv`);
    expect(csv.status).toBe(200);
    expect(csv.text.split('\r\n')[1]).toMatch(/^1,desktop,3647,pearson,/);
    const pdf = await ctx.as('analyst').get(`/analyses/${analysis.id}/report.pdf`);
    expect(pdf.status).toBe(200);

    // A re-run must change something: the same segments are tested again at another alpha.
    const rerun = await ctx.as('analyst').post(`/analyses/${analysis.id}/rerun`, { spec: { ...analysis.spec, alpha: 0.01 } });
    expect(rerun.body.analysis.segments.rows.map((row: { segment: string }) => row.segment)).toEqual(['desktop', 'tablet']);
  });

  it('refuses a segment column that does not exist, and one for a table of counts, with a 422', async () => {
    const missing = await ctx.as('analyst').post('/analyses', { ...request(), segmentColumn: 'browser' });
    expect(missing.status).toBe(422);
    expect(missing.body.error.message).toContain('there is no column named "browser" for the segments');
    const counts = await ctx.as('analyst').post('/analyses', { ...request(), selection: { shape: 'counts', labelColumn: 'variant', countColumn: 'visitor' } });
    expect(counts.status).toBe(422);
    expect(counts.body.error.message).toMatch(/^segments need raw rows/);
    // PostgreSQL answers a count as text, SQLite as a number.
    const stored = await ctx.db('analyses').where({ title: 'Split by device' }).count({ n: '*' }).first();
    expect(Number(stored?.n)).toBe(2);
  });
});
