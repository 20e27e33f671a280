import { parsePastedCounts } from './pasted-counts';

describe('parsePastedCounts', () => {
  it('reads tab-separated lines copied from a spreadsheet, skipping a heading', () => {
    const outcome = parsePastedCounts('Variant\tVisitors\ncontrol\t5012\nnew layout\t4888\n');
    expect(outcome).toEqual({ ok: true, data: { labels: ['control', 'new layout'], counts: [5012, 4888] }, skippedHeading: true, decisions: [] });
  });

  it('accepts commas, semicolons and spaces, and labels that contain spaces', () => {
    const outcome = parsePastedCounts('red, 12\n"dark blue";7\nlight green   3');
    expect(outcome.ok && outcome.data).toEqual({ labels: ['red', 'dark blue', 'light green'], counts: [12, 7, 3] });
  });

  it('reads thousands separators as people paste them and says how', () => {
    expect(parsePastedCounts('control\t1,000\nnew layout\t1,020')).toEqual({
      ok: true,
      data: { labels: ['control', 'new layout'], counts: [1000, 1020] },
      skippedHeading: false,
      decisions: ['The comma was read as a thousands separator (“1,020” is 1020).'],
    });
    const quoted = parsePastedCounts('"north","12,345"\n"south","9,876"');
    expect(quoted.ok && quoted.data).toEqual({ labels: ['north', 'south'], counts: [12345, 9876] });
    const commas = parsePastedCounts('north,12,345\nNorth, upper floor,17');
    expect(commas.ok && commas.data).toEqual({ labels: ['north', 'North, upper floor'], counts: [12345, 17] });
    const spaced = parsePastedCounts('light green 1 234\ndark blue 7');
    expect(spaced.ok && spaced.data).toEqual({ labels: ['light green', 'dark blue'], counts: [1234, 7] });
  });

  it('says when a count is ambiguous', () => {
    expect(parsePastedCounts('a\t1.000\nb\t25')).toEqual({
      ok: false,
      errors: ['Line 1: the count "1.000" is ambiguous: 1000 with the point between thousands, or 1 with the point as a decimal mark; write 1000 or 1.'],
    });
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
