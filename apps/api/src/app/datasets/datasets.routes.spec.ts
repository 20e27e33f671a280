import { createHash } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import { createTestApp, rowCounts, type TestContext } from '../../testing/test-app';

describe('datasets', () => {
  let ctx: TestContext;
  let studyId: number;
  let otherStudyId: number;
  beforeAll(async () => {
    ctx = await createTestApp();
    studyId = (await ctx.as('analyst').post('/studies', { name: 'Checkout split' })).body.id;
    await ctx.as('analyst').post(`/studies/${studyId}/members`, { userId: ctx.userIds.viewer, studyRole: 'reader' });
    otherStudyId = (await ctx.as('admin').post('/studies', { name: 'Not the analyst’s' })).body.id;
  });
  afterAll(() => ctx.close());

  const upload = (content: string | Buffer, fileName: string, fields: Record<string, string> = {}, role: 'analyst' | 'admin' | 'viewer' = 'analyst', study = studyId) => {
    let call = ctx.as(role).post(`/studies/${study}/datasets`);
    for (const [name, value] of Object.entries(fields)) call = call.field(name, value);
    return call.attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content, 'utf8'), fileName);
  };
  const tempFiles = () => readdirSync(join(ctx.config.dataDir, 'uploads-in-progress'));
  const storedFiles = () => (existsSync(join(ctx.config.dataDir, 'datasets')) ? readdirSync(join(ctx.config.dataDir, 'datasets')) : []);
  const tables = ['datasets', 'audit_events', 'analyses'];

  // An invented scenario: visitors assigned to three checkout variants, one row per visitor.
  const assignments = '\uFEFFvisitor,variant,"note, if any"\r\n1,control,\r\n\r\n2,"treatment, blue",""\r\n3,control,"said ""hi"""\r\n4,treatment-red,\r\n';

  it('stores an upload with its checksum, columns, preview, offered and chosen counts, and keeps the file', async () => {
    const response = await upload(assignments, 'assignments.csv', { shape: 'raw', column: 'variant' });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      studyId,
      fileName: 'assignments.csv',
      kind: 'csv',
      sizeBytes: Buffer.byteLength(assignments),
      sha256: createHash('sha256').update(assignments).digest('hex'),
      rowCount: 4,
      columnNames: ['visitor', 'variant', 'note, if any'],
      uploadedBy: { id: ctx.userIds.analyst, name: 'Test analyst' },
      selectedCounts: {
        selection: { shape: 'raw', column: 'variant' },
        labels: ['control', 'treatment-red', 'treatment, blue'],
        counts: [2, 1, 1],
        total: 4,
        skippedEmpty: 0,
      },
    });
    expect(response.body.preview[2]).toEqual(['3', 'control', 'said "hi"']);
    expect(response.body.offeredCounts.map((counts: { selection: { column: string } }) => counts.selection.column)).toEqual([
      'visitor',
      'variant',
      'note, if any',
    ]);
    expect(tempFiles()).toEqual([]);
    expect(storedFiles()).toContain(`${response.body.id}-${response.body.sha256.slice(0, 12)}.csv`);
    const audit = await ctx.db('audit_events').where({ entity_type: 'dataset', entity_id: String(response.body.id) }).first();
    expect(audit.action).toBe('create');
  });

  it('lists a study’s datasets for a reader and shows one with its preview', async () => {
    const list = await ctx.as('viewer').get(`/studies/${studyId}/datasets`);
    expect(list.status).toBe(200);
    expect(list.body[0]).toMatchObject({ fileName: 'assignments.csv', rowCount: 4 });
    const one = await ctx.as('viewer').get(`/datasets/${list.body[0].id}`);
    expect(one.status).toBe(200);
    expect(one.body.preview).toHaveLength(4);
  });

  it.each([
    ['a row with a field too many', 'colour,count\nred,3\ngreen,4,5\nblue,1\n', 'data.csv', {}, 'line 3: this row has 3 fields but the header has 2'],
    ['a TSV file separated by commas', 'colour,count\nred,3\n', 'data.tsv', {}, 'line 1: a TSV file separates its columns with tabs'],
    ['a binary file renamed .csv', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d]), 'picture.csv', {}, 'line 3: the file holds binary data'],
    [
      'a negative count',
      'colour,count\nred,3\ngreen,-4\n',
      'counts.csv',
      { shape: 'counts', labelColumn: 'colour', countColumn: 'count' },
      'line 3: the count "-4" for "green" in column "count" is negative',
    ],
    [
      'a count that is not a number',
      'colour;count\nred;3\ngreen;four\n',
      'counts.csv',
      { shape: 'counts', labelColumn: 'colour', countColumn: 'count' },
      'line 3: the count "four" for "green" in column "count" is not a number',
    ],
    ['a column that does not exist', 'colour,count\nred,3\n', 'data.csv', { shape: 'raw', column: 'size' }, 'line 1: there is no column named "size"'],
  ])('refuses %s with 422 naming the line, and stores nothing', async (_name, content, fileName, fields, message) => {
    const before = await rowCounts(ctx.db, tables);
    const storedBefore = storedFiles();
    const response = await upload(content, fileName, fields);
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('unprocessable');
    expect(response.body.error.message).toContain(message);
    expect(response.body.error.fields[0].path).toBe('file');
    expect(await rowCounts(ctx.db, tables)).toEqual(before);
    expect(tempFiles()).toEqual([]);
    expect(storedFiles()).toEqual(storedBefore);
  });

  it('answers 415 for a kind of file we do not read, and for a body that is not multipart', async () => {
    const pdf = await upload('%PDF-1.4', 'report.pdf');
    expect(pdf.status).toBe(415);
    expect(pdf.body.error.message).toBe('"report.pdf" is not a kind of file we read; send a CSV, TSV or XLSX file (.csv, .txt, .tsv, .tab, .xlsx)');
    const json = await ctx.as('analyst').post(`/studies/${studyId}/datasets`, { file: 'colour,count' });
    expect(json.status).toBe(415);
    expect(tempFiles()).toEqual([]);
  });

  it('answers 400 naming the field for a bad column choice or a missing file', async () => {
    const badShape = await upload('a,b\n1,2\n', 'x.csv', { shape: 'lines' });
    expect(badShape.status).toBe(400);
    expect(badShape.body.error.fields[0].path).toBe('shape');
    const noFile = await ctx.as('analyst').post(`/studies/${studyId}/datasets`).field('shape', 'raw');
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.fields[0].path).toBe('file');
    expect(tempFiles()).toEqual([]);
  });

  it('refuses uploads into a study the caller does not belong to (404) and from a reader (403)', async () => {
    expect((await upload('a\n1\n', 'x.csv', {}, 'analyst', otherStudyId)).status).toBe(404);
    expect((await upload('a\n1\n', 'x.csv', {}, 'viewer')).status).toBe(403);
    expect((await ctx.as('analyst').get(`/studies/${otherStudyId}/datasets`)).status).toBe(404);
    expect(tempFiles()).toEqual([]);
  });

  it('reads an XLSX workbook built with exceljs', async () => {
    const workbook = new ExcelJS.Workbook();
    const sheet = workbook.addWorksheet('Defects this month');
    sheet.addRows([
      ['defect', 'units'],
      ['scratch', 41],
      ['dent', 22],
      ['crack', 7],
    ]);
    const buffer = Buffer.from(await workbook.xlsx.writeBuffer());
    const response = await upload(buffer, 'defects.xlsx', { shape: 'counts', labelColumn: 'defect', countColumn: 'units' });
    expect(response.status).toBe(201);
    expect(response.body.kind).toBe('xlsx');
    expect(response.body.selectedCounts).toMatchObject({ labels: ['scratch', 'dent', 'crack'], counts: [41, 22, 7], total: 70 });
    expect(response.body.columns[1]).toEqual({ name: 'units', distinctValues: 3, wholeNumbers: true, emptyCells: 0 });
  });

  it('counts another column on request from the stored file, and keeps the choice', async () => {
    const created = await upload('shift,defect\nday,scratch\nnight,dent\nday,dent\nday,\n', 'shifts.csv');
    const counts = await ctx.as('analyst').post(`/datasets/${created.body.id}/columns`, { shape: 'raw', column: 'defect' });
    expect(counts.status).toBe(200);
    expect(counts.body).toEqual({ selection: { shape: 'raw', column: 'defect' }, labels: ['dent', 'scratch'], counts: [2, 1], total: 3, skippedEmpty: 1 });
    expect((await ctx.as('viewer').get(`/datasets/${created.body.id}`)).body.selectedCounts).toEqual(counts.body);
    const missing = await ctx.as('analyst').post(`/datasets/${created.body.id}/columns`, { shape: 'counts', labelColumn: 'shift', countColumn: 'defect' });
    expect(missing.status).toBe(422);
    expect(missing.body.error.message).toContain('line 2: the count "scratch" for "day" in column "defect" is not a number');
    const invalid = await ctx.as('analyst').post(`/datasets/${created.body.id}/columns`, { shape: 'counts', labelColumn: 'shift' });
    expect(invalid.status).toBe(400);
    expect(invalid.body.error.fields[0].path).toBe('countColumn');
    expect((await ctx.as('viewer').post(`/datasets/${created.body.id}/columns`, { shape: 'raw', column: 'shift' })).status).toBe(403);
  });

  it('runs an analysis on a dataset column and stores the dataset with it', async () => {
    // Invented: 60 plants scored in three classes under a 1:2:1 expectation.
    const rows = [...Array(18).fill('short'), ...Array(27).fill('medium'), ...Array(15).fill('tall')].map((size, i) => `${i + 1},${size}`);
    const created = await upload(['plant,size', ...rows].join('\n'), 'plants.csv');
    const response = await ctx.as('analyst').post('/analyses', {
      title: 'Plant height classes',
      datasetId: created.body.id,
      selection: { shape: 'raw', column: 'size' },
      spec: { hypothesis: { kind: 'ratio', values: [2, 1, 1] }, tests: ['pearson'] },
    });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({ datasetId: created.body.id, study: { id: studyId } });
    // Labels in natural order: medium, short, tall; 2:1:1 expects 30, 15, 15.
    expect(response.body.spec.observed).toEqual({ labels: ['medium', 'short', 'tall'], counts: [27, 18, 15] });
    // X² = 9/30 + 9/15 + 0/15 = 0.9 (hand arithmetic), 2 df.
    expect(response.body.result.tests.pearson.statistic).toBeCloseTo(0.9, 10);
    expect(response.body.result.tests.pearson.df).toBe(2);
    const row = await ctx.db('analyses').where({ id: response.body.id }).first();
    expect(row.dataset_id).toBe(created.body.id);
  });

  it('refuses an analysis whose hypothesis does not fit the dataset’s categories, naming the field', async () => {
    const created = await upload('colour\nred\ngreen\nred\n', 'colours.csv');
    const response = await ctx.as('analyst').post('/analyses', {
      title: 'Wrong length',
      datasetId: created.body.id,
      selection: { shape: 'raw', column: 'colour' },
      spec: { hypothesis: { kind: 'proportions', values: [0.2, 0.3, 0.5] } },
    });
    expect(response.status).toBe(400);
    expect(response.body.error.fields[0].path).toMatch(/^hypothesis\.values/);
  });

  it('lets only the uploader or an admin delete, removes the file and keeps the name for analyses', async () => {
    const created = await upload('colour\nred\n', 'short-lived.csv');
    await ctx.as('admin').post(`/studies/${studyId}/members`, { userId: ctx.userIds.lead, studyRole: 'contributor' });
    expect((await ctx.as('lead').delete(`/datasets/${created.body.id}`)).status).toBe(403);
    expect((await ctx.as('viewer').delete(`/datasets/${created.body.id}`)).status).toBe(403);
    const stored = `${created.body.id}-${created.body.sha256.slice(0, 12)}.csv`;
    expect(storedFiles()).toContain(stored);
    expect((await ctx.as('analyst').delete(`/datasets/${created.body.id}`)).status).toBe(204);
    expect(storedFiles()).not.toContain(stored);
    expect((await ctx.as('analyst').get(`/datasets/${created.body.id}`)).status).toBe(404);
    const row = await ctx.db('datasets').where({ id: created.body.id }).first();
    expect(row.file_name).toBe('short-lived.csv');
    expect(row.deleted_at).not.toBeNull();
  });
});

describe('dataset upload limit', () => {
  let ctx: TestContext;
  beforeAll(async () => (ctx = await createTestApp({ env: { UPLOAD_LIMIT_MB: '1' } })));
  afterAll(() => ctx.close());

  it('answers 413 for a file over the limit and leaves no file behind', async () => {
    const studyId = (await ctx.as('analyst').post('/studies', { name: 'Limits' })).body.id;
    const big = Buffer.alloc(1024 * 1024 + 10, 'a\n');
    const response = await ctx.as('analyst').post(`/studies/${studyId}/datasets`).attach('file', big, 'big.csv');
    expect(response.status).toBe(413);
    expect(response.body.error.message).toBe('the file is larger than the upload limit of 1 MB');
    expect(readdirSync(join(ctx.config.dataDir, 'uploads-in-progress'))).toEqual([]);
    expect(await rowCounts(ctx.db, ['datasets'])).toEqual({ datasets: 0 });
  });
});
