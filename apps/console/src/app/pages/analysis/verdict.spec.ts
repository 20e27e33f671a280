import { verdictFor } from './verdict';

describe('verdictFor', () => {
  it('says the counts differ when p is below alpha', () => {
    const verdict = verdictFor(0.0179, 0.05);
    expect(verdict.differs).toBe(true);
    expect(verdict.headline).toBe('The observed counts differ from what was expected.');
    expect(verdict.detail).toBe('p = .018 is below the chosen alpha of 0.05.');
  });

  it('does not claim the expectation is proven when p is above alpha', () => {
    const verdict = verdictFor(0.3, 0.05);
    expect(verdict.differs).toBe(false);
    expect(verdict.detail).toContain('does not prove the expectation holds');
  });

  it('treats p equal to alpha as not below it', () => expect(verdictFor(0.05, 0.05).differs).toBe(false));
});
