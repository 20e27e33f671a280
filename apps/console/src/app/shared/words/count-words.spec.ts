import { countWords } from './count-words';

// English plural rules (Unicode CLDR, the data behind Intl.PluralRules): "one" for exactly 1, "other" otherwise.
describe('countWords', () => {
  it.each([
    [1, '1 degree of freedom'],
    [0, '0 degrees of freedom'],
    [4, '4 degrees of freedom'],
    [1500, '1,500 degrees of freedom'],
  ])('%p → %s', (count, words) => expect(countWords(count, 'degree of freedom', 'degrees of freedom')).toBe(words));

  it('says "1 study shown", not "1 studies shown"', () => expect(`${countWords(1, 'study', 'studies')} shown`).toBe('1 study shown'));
});
