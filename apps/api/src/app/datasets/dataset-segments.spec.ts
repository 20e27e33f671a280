import type { User } from '@tallyfit/contracts';
import { createTestApp, type TestContext } from '../../testing/test-app';
import { listAnalyses } from '../analyses/analyses.service';
import { markdownReport } from '../reports/markdown-report';
import { segmentsCsv } from '../reports/categories-csv';
import { createDatasetAnalysis } from './datasets.service';

/**
 * An analysis of a dataset split by a second column: counted in one pass, every segment tested,
 * stored with the analysis, listed in the history and written into the reports.
 */
describe('analyses of a dataset with segments', () => {
  jest.setTimeout(120_000);
  let ctx: TestContext;
  let analyst: User;
  let datasetId: number;
  beforeAll(async () => {
    ctx = await createTestApp();
    analyst = (await ctx.as('analyst').get('/auth/me')).body as User;
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

  const request = {
    title: 'Split by device',
    selection: { shape: 'raw' as const, column: 'variant' },
    spec: { hypothesis: { kind: 'equal' as const } },
    segmentColumn: 'device',
  };

  it('stores the ranked segments, lists the split in the history, and writes it into the reports', async () => {
    const { inProcessEngine } = await import('../engine/engine-runner');
    const analysis = await createDatasetAnalysis(ctx.db, inProcessEngine(), ctx.config.dataDir, analyst, datasetId, request);
    expect(analysis.segmentColumn).toBe('device');
    expect(analysis.result.n).toBe(3749);
    const segments = analysis.segments!;
    expect(segments.adjust).toBe('holm');
    expect(segments.rows.map((row) => [row.segment, row.n, row.rank])).toEqual([
      ['desktop', 3647, 1],
      ['tablet', 100, 2],
    ]);
    expect(segments.rows[0].p).toBeCloseTo(0.0179, 4);
    // Holm with two segments: the smaller p doubled.
    expect(segments.rows[0].pAdjusted).toBeCloseTo(2 * segments.rows[0].p!, 12);
    expect(segments.rows[1].p).toBeCloseTo(1, 12);

    const history = await listAnalyses(ctx.db, analyst, { page: 1, pageSize: 25, sort: 'date', order: 'desc' });
    expect(history.items[0]).toMatchObject({ id: analysis.id, segmentColumn: 'device' });

    const markdown = markdownReport({
      id: analysis.id,
      title: analysis.title,
      studyId: null,
      studyName: null,
      datasetName: 'visits.csv',
      authorName: analysis.author.name,
      createdAt: analysis.createdAt,
      engineVersion: analysis.engineVersion,
      notes: null,
      result: analysis.result,
      segments: { column: 'device', result: segments },
    });
    expect(markdown).toContain('## Segments by device');
    expect(markdown).toContain('| 1 | desktop | 3,647 |');
    expect(segmentsCsv(segments).split('\r\n')[1]).toMatch(/^1,desktop,3647,pearson,/);
  });

  it('refuses a segment column for a table of counts, and a column that does not exist, with a 422', async () => {
    const { inProcessEngine } = await import('../engine/engine-runner');
    const missing = await createDatasetAnalysis(ctx.db, inProcessEngine(), ctx.config.dataDir, analyst, datasetId, { ...request, segmentColumn: 'browser' }).catch((error: unknown) => error);
    expect(missing).toMatchObject({ status: 422, message: expect.stringContaining('there is no column named "browser" for the segments') });
    const counts = await createDatasetAnalysis(ctx.db, inProcessEngine(), ctx.config.dataDir, analyst, datasetId, {
      ...request,
      selection: { shape: 'counts', labelColumn: 'variant', countColumn: 'visitor' },
    }).catch((error: unknown) => error);
    expect(counts).toMatchObject({ status: 422, message: expect.stringMatching(/^segments need raw rows/) });
  });
});
