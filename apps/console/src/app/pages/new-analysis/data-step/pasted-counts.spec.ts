import { parsePastedCounts } from './pasted-counts';

describe('parsePastedCounts', () => {
  it('reads tab-separated lines copied from a spreadsheet, skipping a heading', () => {
    const outcome = parsePastedCounts('Variant\tVisitors\ncontrol\t5012\nnew layout\t4888\n');
    expect(outcome).toEqual({ ok: true, data: { labels: ['control', 'new layout'], counts: [5012, 4888] }, skippedHeading: true });
  });

  it('accepts commas, semicolons and spaces, and labels that contain spaces', () => {
    const outcome = parsePastedCounts('red, 12\n"dark blue";7\nlight green   3');
    expect(outcome.ok && outcome.data).toEqual({ labels: ['red', 'dark blue', 'light green'], counts: [12, 7, 3] });
  });

  it('names the line of a count that is not a whole number', () => {
    const outcome = parsePastedCounts('a\t3\nb\t2.5\nc\t-1');
    expect(outcome).toEqual({
      ok: false,
      errors: ['Line 2: the count "2.5" is not a whole number of 0 or more.', 'Line 3: the count "-1" is not a whole number of 0 or more.'],
    });
  });

  it('refuses a repeated category and a line without a count', () => {
    const outcome = parsePastedCounts('a 1\na 2\nlonely');
    expect(outcome.ok).toBe(false);
    expect(!outcome.ok && outcome.errors).toEqual([
      'Line 2: the category "a" already appears on line 1.',
      'Line 3: expected a category and a count, found only "lonely".',
    ]);
  });

  it('needs two categories and at least one observation', () => {
    expect(parsePastedCounts('')).toEqual({ ok: false, errors: ['Paste at least two lines, each a category and its count.'] });
    expect(parsePastedCounts('only 4')).toEqual({ ok: false, errors: ['At least two categories are needed; found 1.'] });
    expect(parsePastedCounts('a 0\nb 0')).toEqual({ ok: false, errors: ['Every count is 0: at least one observation is needed.'] });
  });
});
