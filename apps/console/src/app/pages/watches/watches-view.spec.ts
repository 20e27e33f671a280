import {
  apiQueryFromWatchesView,
  intakeText,
  sequentialPText,
  urlFromWatchesView,
  watchesFilterCount,
  watchesViewFromUrl,
} from './watches-view';

describe('the Watches page view', () => {
  it('reads a hand-edited address without failing, leaving out what the API would refuse', () => {
    expect(watchesViewFromUrl({ page: '0', studyId: 'x', state: 'asleep', waiting: 'yes', q: '  ' })).toEqual({
      page: 1,
      studyId: null,
      state: null,
      waiting: false,
      q: null,
    });
  });

  it('keeps a filtered view in the address and asks the API for the same', () => {
    const view = watchesViewFromUrl({ page: '2', studyId: '4', state: 'alarm', waiting: 'true', q: ' checkout ' });
    expect(view).toEqual({ page: 2, studyId: 4, state: 'alarm', waiting: true, q: 'checkout' });
    expect(urlFromWatchesView(view)).toEqual({ page: '2', studyId: '4', state: 'alarm', waiting: 'true', q: 'checkout' });
    expect(apiQueryFromWatchesView(view)).toEqual({ page: 2, pageSize: 25, studyId: '4', state: 'alarm', waiting: 'true', q: 'checkout' });
    expect(watchesFilterCount(view)).toBe(4);
  });

  it('leaves defaults out of the address', () => {
    const view = watchesViewFromUrl({});
    expect(urlFromWatchesView(view)).toEqual({ page: null, studyId: null, state: null, waiting: null, q: null });
    expect(watchesFilterCount(view)).toBe(0);
  });

  it('says the sequential p beside alpha, and nothing before the first batch', () => {
    expect(sequentialPText({ batchCount: 0, sequentialP: 1, alpha: 0.05 })).toBe('No batches yet');
    // APA style, as the rest of the console: three decimals, no leading zero, "< .001" below that (common practice, no source).
    expect(sequentialPText({ batchCount: 3, sequentialP: 0.0031, alpha: 0.05 })).toBe('p = .003 (alpha 0.05)');
    expect(sequentialPText({ batchCount: 30, sequentialP: 2e-6, alpha: 0.01 })).toBe('p < .001 (alpha 0.01)');
  });

  it('counts batches and observations in words', () => {
    expect(intakeText({ batchCount: 1, n: 1 })).toBe('1 batch · 1 observation');
    expect(intakeText({ batchCount: 30, n: 600_000 })).toBe('30 batches · 600,000 observations');
  });
});
