import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import type { CountSelection } from '@tallyfit/contracts';
import { DatasetFormatError } from './dataset-format-error';
import { countCategories, scanTable } from './dataset-scan';
import type { FileKind } from './file-kind';

describe('reading uploaded tables', () => {
  let dir: string;
  beforeAll(() => (dir = mkdtempSync(join(tmpdir(), 'tallyfit-scan-'))));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  let fileNumber = 0;
  function file(content: string | Buffer, extension = 'csv'): string {
    const path = join(dir, `table-${++fileNumber}.${extension}`);
    writeFileSync(path, content);
    return path;
  }
  const scan = (path: string, kind: FileKind = 'csv', selection?: CountSelection) => scanTable(path, kind, selection);
  async function formatError(promise: Promise<unknown>): Promise<DatasetFormatError> {
    const error = await promise.then(
      () => undefined,
      (reason: unknown) => reason,
    );
    expect(error).toBeInstanceOf(DatasetFormatError);
    return error as DatasetFormatError;
  }

  it('reads quoted fields holding separators, quotes and line breaks', async () => {
    const path = file('shop,remark\n"North, upper floor","said ""fine"""\n"South","two\nlines"\n');
    const result = await scan(path, 'csv', { shape: 'raw', column: 'shop' });
    expect(result.rowCount).toBe(2);
    expect(result.preview).toEqual([
      ['North, upper floor', 'said "fine"'],
      ['South', 'two\nlines'],
    ]);
    expect(result.selectedCounts).toMatchObject({ labels: ['North, upper floor', 'South'], counts: [1, 1], total: 2 });
  });

  it('drops a byte-order mark, reads CRLF line ends and skips empty lines', async () => {
    const path = file('\uFEFFvariant,visitors\r\n\r\nA,510\r\nB,490\r\n\r\n,\r\n');
    const result = await scan(path, 'csv', { shape: 'counts', labelColumn: 'variant', countColumn: 'visitors' });
    expect(result.columns.map((column) => column.name)).toEqual(['variant', 'visitors']);
    expect(result.selectedCounts).toMatchObject({ labels: ['A', 'B'], counts: [510, 490], total: 1000 });
  });

  it('finds semicolons as the separator and counts raw categories in natural order', async () => {
    const path = file('digit;amount\n1;12.50\n10;3\n2;8\n1;9\n');
    const result = await scan(path, 'csv', { shape: 'raw', column: 'digit' });
    expect(result.selectedCounts).toMatchObject({ labels: ['1', '2', '10'], counts: [2, 1, 1] });
    expect(result.columns).toEqual([
      { name: 'digit', distinctValues: 3, wholeNumbers: true, emptyCells: 0 },
      { name: 'amount', distinctValues: 4, wholeNumbers: false, emptyCells: 0 },
    ]);
  });

  it('offers the counts of columns with few different values, not of those with many', async () => {
    const rows = Array.from({ length: 200 }, (_, i) => `${i},${['red', 'green', 'blue'][i % 3]}`);
    const result = await scan(file(['id,colour', ...rows].join('\n')));
    expect(result.columns[0].distinctValues).toBeNull();
    expect(result.offeredCounts).toEqual([
      { selection: { shape: 'raw', column: 'colour' }, labels: ['blue', 'green', 'red'], counts: [66, 67, 67], total: 200, skippedEmpty: 0 },
    ]);
  });

  it('names the line of a row with the wrong number of fields and mentions the separator', async () => {
    const error = await formatError(scan(file('colour,count\nred,3\ngreen,4,5\nblue,6\n')));
    expect(error.message).toMatch(/^line 3: this row has 3 fields but the header has 2; check the separator \(the header uses commas\)/);
  });

  it('names the exact line of a bad row deep inside a file read in many chunks', async () => {
    const rows = Array.from({ length: 60_000 }, (_, i) => (i === 45_000 ? 'green;4' : `${i % 7 === 0 ? '"sea\ngreen"' : 'red'},${i}`));
    const error = await formatError(scan(file(['colour,count', ...rows].join('\n'))));
    // Every seventh row before it spans two lines: 45 000 rows, 6 429 of them two lines long, plus the header.
    expect(error.message).toMatch(/^line 51431: this row has 1 field but the header has 2/);
  });

  it('counts rows with an empty category as skipped, and skips rows with no text at all', async () => {
    const path = file('id;shop\r\n1;North\r\n2;\r\n3;  \r\n;\r\n4;"North"\r\n5;South');
    const result = await scan(path, 'csv', { shape: 'raw', column: 'shop' });
    expect(result.rowCount).toBe(5);
    expect(result.selectedCounts).toEqual({ selection: { shape: 'raw', column: 'shop' }, labels: ['North', 'South'], counts: [2, 1], total: 3, skippedEmpty: 2 });
  });

  it('reads CRLF inside a quoted value, a doubled quote, and a last row without a line end', async () => {
    const path = file('note,shop\r\n"first\r\nsecond",A\r\n"say ""hi""",B\r\nplain,A');
    const result = await scan(path, 'csv', { shape: 'raw', column: 'shop' });
    expect(result.preview).toEqual([
      ['first\r\nsecond', 'A'],
      ['say "hi"', 'B'],
      ['plain', 'A'],
    ]);
    expect(result.selectedCounts).toMatchObject({ labels: ['A', 'B'], counts: [2, 1] });
  });

  it('refuses a quote inside a value that does not start with one, naming its line', async () => {
    const error = await formatError(scan(file('size,n\n5" screen,2\n')));
    expect(error.message).toMatch(/^line 2: a quote appears inside a value that does not start with a quote/);
  });

  it('reads counts with thousands separators and says how it read them', async () => {
    const path = file('variant\tvisitors\ncontrol\t1,000\nnew layout\t1,020\n', 'tsv');
    const result = await scan(path, 'tsv', { shape: 'counts', labelColumn: 'variant', countColumn: 'visitors' });
    expect(result.selectedCounts).toMatchObject({ counts: [1000, 1020], countDecisions: ['The comma was read as a thousands separator (“1,020” is 1020).'] });
    expect(result.columns[1].wholeNumbers).toBe(true);
  });

  it('names an ambiguous count and both its readings', async () => {
    const path = file('variant\tvisitors\ncontrol\t1.000\nnew layout\t25\n', 'tsv');
    const error = await formatError(scan(path, 'tsv', { shape: 'counts', labelColumn: 'variant', countColumn: 'visitors' }));
    expect(error.message).toBe(
      'line 2: the count "1.000" for "control" in column "visitors" is ambiguous: 1000 with the point between thousands, or 1 with the point as a decimal mark; write 1000 or 1; counts are whole numbers of 0 or more',
    );
  });

  it('refuses a TSV file that is separated by commas', async () => {
    const error = await formatError(scan(file('colour,count\nred,3\n', 'tsv'), 'tsv'));
    expect(error.message).toMatch(/^line 1: a TSV file separates its columns with tabs, but this header has none and uses commas/);
  });

  it('reads a TSV file', async () => {
    const result = await scan(file('colour\tcount\nred\t3\ngreen\t4\n', 'tsv'), 'tsv', { shape: 'counts', labelColumn: 'colour', countColumn: 'count' });
    expect(result.selectedCounts).toMatchObject({ labels: ['red', 'green'], counts: [3, 4] });
  });

  it('refuses a binary file renamed .csv', async () => {
    // A PNG signature: its first line break is at byte 5, its second at byte 7, its first zero byte after that.
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52]);
    const error = await formatError(scan(file(png)));
    expect(error.message).toMatch(/^line 3: the file holds binary data \(a zero byte\), not text/);
  });

  it('refuses an unclosed quote, naming where it started to go wrong', async () => {
    const error = await formatError(scan(file('colour,count\nred,3\n"green,4\nblue,5\n')));
    expect(error.message).toMatch(/^line \d+: a quoted value is opened but never closed/);
  });

  it.each([
    ['-4', 'is negative'],
    ['many', 'is not a number'],
    ['2.5', 'is not a whole number'],
  ])('refuses the count %s, naming its line', async (count, problem) => {
    const path = file(`colour,count\nred,3\n\ngreen,${count}\nblue,6\nwhite,7\n`);
    const error = await formatError(scan(path, 'csv', { shape: 'counts', labelColumn: 'colour', countColumn: 'count' }));
    expect(error.message).toBe(`line 4: the count "${count}" for "green" in column "count" ${problem}; counts are whole numbers of 0 or more`);
  });

  it('refuses a label listed twice in a table of counts', async () => {
    const path = file('colour,count\nred,3\ngreen,4\nred,1\nblue,2\n');
    const error = await formatError(scan(path, 'csv', { shape: 'counts', labelColumn: 'colour', countColumn: 'count' }));
    expect(error.message).toBe('line 4: the label "red" appears a second time (first on line 2); each category needs one row');
  });

  it('names the columns when the chosen one does not exist', async () => {
    const error = await formatError(countCategories(file('a,b\n1,2\n'), 'csv', { shape: 'raw', column: 'c' }));
    expect(error.message).toBe('line 1: there is no column named "c" for the categories; the columns are "a", "b"');
  });

  it('refuses an empty file and a header without rows', async () => {
    expect((await formatError(scan(file('')))).message).toBe('line 1: the file is empty');
    expect((await formatError(scan(file('\n\n  \n')))).message).toBe('line 1: the file holds only empty lines');
    expect((await formatError(scan(file('a,b\n')))).message).toBe('line 2: the file has a header but no data rows');
  });

  it('reads Latin-1 text as older spreadsheet exports write it', async () => {
    const path = file(Buffer.from('région,n\nÎle,3\nCôte,4\n', 'latin1'));
    const result = await scan(path, 'csv', { shape: 'counts', labelColumn: 'région', countColumn: 'n' });
    expect(result.selectedCounts?.labels).toEqual(['Île', 'Côte']);
  });

  it('reads the first worksheet of an XLSX workbook', async () => {
    const workbook = new ExcelJS.Workbook();
    const sheet = workbook.addWorksheet('Defects');
    sheet.addRow(['defect', 'seen']);
    sheet.addRow(['scratch', 14]);
    sheet.addRow([]);
    sheet.addRow(['dent', { formula: '3+4', result: 7 }]);
    sheet.addRow([{ richText: [{ text: 'cr' }, { text: 'ack' }] }, 2]);
    workbook.addWorksheet('Other').addRow(['ignored']);
    const path = join(dir, 'defects.xlsx');
    await workbook.xlsx.writeFile(path);
    const result = await scan(path, 'xlsx', { shape: 'counts', labelColumn: 'defect', countColumn: 'seen' });
    expect(result.rowCount).toBe(3);
    expect(result.selectedCounts).toMatchObject({ labels: ['scratch', 'dent', 'crack'], counts: [14, 7, 2], total: 23 });
  });

  it('names the row of a bad count in a worksheet', async () => {
    const workbook = new ExcelJS.Workbook();
    const sheet = workbook.addWorksheet('Counts');
    sheet.addRows([['defect', 'seen'], ['scratch', 14], ['dent', -2]]);
    const path = join(dir, 'bad-count.xlsx');
    await workbook.xlsx.writeFile(path);
    const error = await formatError(scan(path, 'xlsx', { shape: 'counts', labelColumn: 'defect', countColumn: 'seen' }));
    expect(error.message).toMatch(/^row 3: the count "-2" for "dent" in column "seen" is negative/);
  });

  it('refuses a damaged workbook', async () => {
    const error = await formatError(scan(file('PK\u0003\u0004 not really a zip', 'xlsx'), 'xlsx'));
    expect(error.message).toMatch(/not a readable XLSX workbook/);
  });
});
