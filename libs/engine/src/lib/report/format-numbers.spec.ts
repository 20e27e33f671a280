import { formatCount, formatP, formatPercent, formatPValue, formatShare, formatStatistic, groupDigits } from './format-numbers';

describe('APA number formatting (Publication Manual, 7th ed., 2020)', () => {
  it('writes p with three decimals, no leading zero, and bounds at .001 and .999', () => {
    expect(formatP(0.017888)).toBe('p = .018');
    expect(formatP(0.0004)).toBe('p < .001');
    expect(formatP(0.001)).toBe('p = .001');
    expect(formatP(0.9996)).toBe('p > .999');
    expect(formatPValue(0.5)).toBe('.500');
    expect(formatPValue(0)).toBe('< .001');
  });

  it('writes statistics with two decimals and groups thousands with commas', () => {
    expect(formatStatistic(5.6071)).toBe('5.61');
    expect(formatStatistic(0.004)).toBe('0.00');
    expect(formatStatistic(12345.678)).toBe('12,345.68');
    expect(groupDigits(3647)).toBe('3,647');
    expect(groupDigits(-1234567.5)).toBe('-1,234,567.5');
    expect(groupDigits(999)).toBe('999');
  });

  it('writes counts, shares and levels readably', () => {
    expect(formatCount(28.125)).toBe('28.1');
    expect(formatCount(1234.56)).toBe('1,234.6');
    expect(formatCount(40)).toBe('40');
    expect(formatShare(0.2952)).toBe('0.30');
    expect(formatShare(0.0012)).toBe('0.0012');
    expect(formatPercent(0.95)).toBe('95%');
    expect(formatPercent(0.999)).toBe('99.9%');
  });
});
