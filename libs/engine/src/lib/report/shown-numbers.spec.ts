import { analyze } from '../analyze';
import { categoryCells, categoryHeadings, effectSizeText, formatExpectedCount, shareDecimals, testCells } from './shown-numbers';

describe('the numbers every output prints', () => {
  // Common practice, no source: a table gives as many decimals as it takes for two different values not to print alike.
  it('gives shares a fourth decimal when three would hide a departure', () => {
    // 5,004 of 10,000 against one half: 0.5004 vs 0.5000 (hand arithmetic); at three decimals both read 0.500.
    const result = analyze({ observed: { labels: ['A', 'B'], counts: [5004, 4996] }, hypothesis: { kind: 'equal' } });
    expect(shareDecimals(result)).toBe(4);
    const [a] = categoryCells(result);
    expect([a.share, a.expectedShare]).toEqual(['0.5004', '0.5000']);
  });

  it('keeps three decimals when they already show every departure', () => {
    const result = analyze({ observed: { labels: ['A', 'B', 'C'], counts: [30, 20, 10] }, hypothesis: { kind: 'equal' } });
    expect(shareDecimals(result)).toBe(3);
  });

  it('prints both ends of an interval with the same decimals', () => {
    const result = analyze({ observed: { labels: ['A', 'B', 'C'], counts: [1, 300, 700] }, hypothesis: { kind: 'proportions', values: [0.002, 0.3, 0.698] } });
    for (const row of categoryCells(result)) {
      expect(row.intervalLow.split('.')[1].length).toBe(row.intervalHigh.split('.')[1].length);
    }
  });

  it('prints expected counts with two decimals, grouped, never as 0', () => {
    // 1,251 / 4 = 312.75 (hand arithmetic)
    expect(formatExpectedCount(312.75)).toBe('312.75');
    expect(formatExpectedCount(1234.5)).toBe('1,234.50');
    expect(formatExpectedCount(40)).toBe('40.00');
    expect(formatExpectedCount(0.0012)).toBe('0.0012');
  });

  // APA Publication Manual, 7th ed. (2020), section 6.36: no leading zero, "< .001" below that.
  it('prints p the APA way in each category and test', () => {
    const result = analyze({ observed: { labels: ['A', 'B'], counts: [700, 300] }, hypothesis: { kind: 'equal' }, tests: ['pearson'] });
    expect(categoryCells(result)[0].p).toBe('< .001');
    expect(testCells(result)[0].p).toBe('< .001');
    expect(testCells(result)[0].how).toBe('Chi-square distribution with 1 degree of freedom.');
  });

  it('prints a typeset minus sign and headings of our own', () => {
    const result = analyze({ observed: { labels: ['A', 'B'], counts: [40, 60] }, hypothesis: { kind: 'equal' } });
    expect(categoryCells(result)[0].gap.startsWith('−')).toBe(true);
    expect(Object.values(categoryHeadings(result)).join(' ')).not.toMatch(/residual/i);
  });

  it('writes w with its size word and interval', () => {
    const result = analyze({ observed: { labels: ['A', 'B'], counts: [40, 60] }, hypothesis: { kind: 'equal' } });
    // w = √(X²/n) = √(4/100) = 0.20 (hand arithmetic: X² = (10² + 10²)/50 = 4)
    expect(effectSizeText(result)).toMatch(/^w = 0\.20 \(small\), 95% CI \[\d\.\d\d, \d\.\d\d\]$/);
  });
});
