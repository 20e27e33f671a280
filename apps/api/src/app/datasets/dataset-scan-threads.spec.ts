import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DatasetFormatError } from './dataset-format-error';
import { countCategories, countSegments, scanTable } from './dataset-scan';
import { closeScanPools } from './range-threads';

/**
 * Files of 8 MB and more are counted in two worker threads, one byte range each (the threads run
 * the TypeScript worker through the test runner). Expected counts come from how each file is built.
 */
describe('counting large tables in two threads', () => {
  jest.setTimeout(120_000);
  let dir: string;
  beforeAll(() => (dir = mkdtempSync(join(tmpdir(), 'tallyfit-threads-'))));
  afterAll(async () => {
    rmSync(dir, { recursive: true, force: true });
    await closeScanPools();
  });

  const colours = ['red', 'green', 'blue', 'white'];
  /** `rows` rows `i,colour,shop`; colour i % 4, shop "north"/"south" by i % 3 === 0. */
  const rowsText = (from: number, rows: number) => {
    const lines: string[] = [];
    for (let i = from; i < from + rows; i++) lines.push(`${i},${colours[i % 4]},${i % 3 === 0 ? 'north' : 'south'}`);
    return lines.join('\n') + '\n';
  };
  const expectedColours = (from: number, rows: number) => {
    const counts = [0, 0, 0, 0];
    for (let i = from; i < from + rows; i++) counts[i % 4]++;
    return counts;
  };

  it('counts a large file in two halves as one pass would, and profiles it', async () => {
    const rows = 700_000; // about 12 MB
    const path = join(dir, 'large.csv');
    writeFileSync(path, 'id,colour,shop\n' + rowsText(0, rows));
    const counts = await countCategories(path, 'csv', { shape: 'raw', column: 'colour' });
    const expected = expectedColours(0, rows);
    expect(counts).toEqual({ selection: { shape: 'raw', column: 'colour' }, labels: ['blue', 'green', 'red', 'white'], counts: [expected[2], expected[1], expected[0], expected[3]], total: rows, skippedEmpty: 0 });
    const scan = await scanTable(path, 'csv');
    expect(scan.rowCount).toBe(rows);
    expect(scan.columns).toEqual([
      { name: 'id', distinctValues: null, wholeNumbers: true, emptyCells: 0 },
      { name: 'colour', distinctValues: 4, wholeNumbers: false, emptyCells: 0 },
      { name: 'shop', distinctValues: 2, wholeNumbers: false, emptyCells: 0 },
    ]);
    expect(scan.preview[0]).toEqual(['0', 'red', 'north']);
  });

  it('reads again from the right place when a quoted value with line breaks straddles the split', async () => {
    const before = 200_000;
    const after = 200_000;
    // A quoted note of about 6 MB, 600 000 lines, sits in the middle of the file, where the split falls.
    const note = `"${'a line of a long note\n'.repeat(300_000)}"`;
    const path = join(dir, 'straddle.csv');
    writeFileSync(path, 'id,colour,shop\n' + rowsText(0, before) + `${before},"red",${note}\n` + rowsText(before + 1, after));
    const counts = await countCategories(path, 'csv', { shape: 'raw', column: 'colour' });
    const expected = expectedColours(0, before + 1 + after);
    expect(counts.counts).toEqual([expected[2], expected[1], expected[0], expected[3]]);
    expect(counts.total).toBe(before + 1 + after);
  });

  it('names the line of a ragged row in the second half', async () => {
    const rows = 700_000;
    const path = join(dir, 'ragged.csv');
    writeFileSync(path, 'id,colour,shop\n' + rowsText(0, rows - 10) + 'oops,red\n' + rowsText(rows, 9));
    const error = await countCategories(path, 'csv', { shape: 'raw', column: 'colour' }).catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(DatasetFormatError);
    // header on line 1, rows - 10 rows, then the bad one
    expect((error as DatasetFormatError).message).toMatch(new RegExp(`^line ${rows - 10 + 2}: this row has 2 fields but the header has 3`));
  });

  it('counts by two columns at once, leaving out rows without a segment', async () => {
    const rows = 700_000;
    const path = join(dir, 'segments.csv');
    writeFileSync(path, 'id,colour,shop\n' + rowsText(0, rows) + '1,red,\n2,,north\n');
    const counts = await countSegments(path, 'csv', { shape: 'raw', column: 'colour' }, 'shop');
    const north = [0, 0, 0, 0];
    const south = [0, 0, 0, 0];
    for (let i = 0; i < rows; i++) (i % 3 === 0 ? north : south)[i % 4]++;
    const sorted = (c: number[]) => [c[2], c[1], c[0], c[3]];
    expect(counts).toEqual({
      selection: { shape: 'raw', column: 'colour' },
      segmentColumn: 'shop',
      labels: ['blue', 'green', 'red', 'white'],
      segments: [
        { segment: 'north', counts: sorted(north), total: north.reduce((a, b) => a + b, 0) },
        { segment: 'south', counts: sorted(south), total: south.reduce((a, b) => a + b, 0) },
      ],
      total: rows,
      skippedEmpty: 1,
      skippedEmptySegment: 1,
    });
  });
});
