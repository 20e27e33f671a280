import { readCount, readCountColumn } from './count-text';

describe('readCount', () => {
  it.each([
    ['1234', 1234],
    ['12.0', 12],
    ['12,00', 12],
    ['1,234', 1234],
    ['1.234', 1234],
    ['1 234', 1234],
    ['1\u00a0234\u00a0567', 1234567],
    ["1'234", 1234],
    ['1,234,567', 1234567],
    ['1.234.567', 1234567],
    ['1,234.00', 1234],
    ['1.234,00', 1234],
  ])('reads %j as %d', (text, value) => {
    expect(readCount(text)).toMatchObject({ ok: true, value });
  });

  it.each([
    ['', 'empty'],
    ['-4', 'negative'],
    ['2.5', 'fraction'],
    ['1,5', 'fraction'],
    ['1,234.50', 'fraction'],
    ['many', 'not-a-number'],
    ['1,23,4', 'not-a-number'],
    ['12 34', 'not-a-number'],
    ['99999999999999999', 'too-large'],
  ])('refuses %j as %s', (text, problem) => {
    expect(readCount(text)).toMatchObject({ ok: false, problem });
  });

  it('says that "1.000" alone is ambiguous and gives both readings', () => {
    expect(readCount('1.000')).toEqual({
      ok: false,
      problem: 'ambiguous',
      mark: '.',
      readings: [1000, 1],
      message: 'is ambiguous: 1000 with the point between thousands, or 1 with the point as a decimal mark; write 1000 or 1',
    });
  });
});

describe('readCountColumn', () => {
  it('settles an ambiguous value by the other values of the column and says how it read them', () => {
    expect(readCountColumn(['1,000', '1,020', '987'])).toEqual({
      values: [1000, 1020, 987],
      problems: [],
      decisions: ['The comma was read as a thousands separator (“1,020” is 1020).'],
    });
    expect(readCountColumn(['2,000', '12,00']).values).toEqual([2, 12]);
  });

  it('keeps an ambiguous value ambiguous when nothing settles it', () => {
    const reading = readCountColumn(['1.000', '25']);
    expect(reading.values).toEqual([undefined, 25]);
    expect(reading.problems).toEqual([{ index: 0, problem: 'ambiguous', message: expect.stringMatching(/^is ambiguous: 1000 .* or 1 /) }]);
  });

  it('reports values whose mark is read both ways in one column', () => {
    const reading = readCountColumn(['1,234', '12,00', '7']);
    expect(reading.values).toEqual([undefined, undefined, 7]);
    expect(reading.problems[0]).toEqual({
      index: 0,
      problem: 'ambiguous',
      message: 'is ambiguous: the comma separates thousands in "1,234" but is a decimal mark in "12,00"; use one convention',
    });
  });
});
