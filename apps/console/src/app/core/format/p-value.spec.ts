import { formatP, formatStatistic } from './p-value';

// APA Publication Manual, 7th ed. (2020), section 6.36: exact p to two or three decimals,
// no leading zero, and "p < .001" below that.
describe('formatP', () => {
  it.each([
    [0.0179, '= .018'],
    [0.5, '= .500'],
    [0.001, '= .001'],
    [0.00099, '< .001'],
    [1e-300, '< .001'],
    [0.9994, '= .999'],
    [0.9996, '> .999'],
    [1, '> .999'],
  ])('writes %p as "%s"', (p, text) => expect(formatP(p)).toBe(text));

  it('writes a dash for a value that is not a number', () => expect(formatP(Number.NaN)).toBe('—'));
});

describe('formatStatistic', () => {
  it('rounds to two decimals', () => expect(formatStatistic(5.60707)).toBe('5.61'));
});
