import { activeFilterCount, apiQueryFromView, dateOf, dayOf, DEFAULT_VIEW, SORT_CHOICES, urlFromView, viewFromUrl } from './history-query';

describe('the history view in the URL', () => {
  it('reads every filter, sort and page from the query string', () => {
    const view = viewFromUrl({
      page: '3',
      pageSize: '50',
      sort: 'p',
      order: 'asc',
      studyId: '4',
      author: 'me',
      test: 'exact',
      status: 'in_review',
      significant: 'false',
      from: '2026-11-01',
      to: '2026-11-30',
      q: '  weekday  ',
    });
    expect(view).toEqual({
      page: 3,
      pageSize: 50,
      sort: 'p',
      order: 'asc',
      studyId: 4,
      author: 'me',
      test: 'exact',
      status: 'in_review',
      significant: false,
      from: '2026-11-01',
      to: '2026-11-30',
      q: 'weekday',
    });
  });

  it('falls back to defaults for values the API would refuse', () => {
    expect(
      viewFromUrl({ page: '0', pageSize: '7', sort: 'colour', order: 'up', studyId: 'x', author: 'them', test: 'z', status: 'lost', significant: 'maybe', from: '1 Nov', q: ' ' }),
    ).toEqual(DEFAULT_VIEW);
  });

  it('writes only what differs from the default view, so links stay short and round-trip', () => {
    const view = { ...DEFAULT_VIEW, status: 'in_review' as const, q: 'panel' };
    const params = urlFromView(view);
    expect(Object.entries(params).filter(([, v]) => v !== null)).toEqual([
      ['status', 'in_review'],
      ['q', 'panel'],
    ]);
    const asUrl = Object.fromEntries(Object.entries(params).filter(([, v]) => v !== null)) as Record<string, string>;
    expect(viewFromUrl(asUrl)).toEqual(view);
  });

  it('asks the API for whole local days and the chosen filters only', () => {
    const query = apiQueryFromView({ ...DEFAULT_VIEW, significant: true, from: '2026-11-01', to: '2026-11-01', author: '7' });
    expect(query).toMatchObject({ page: 1, pageSize: 25, sort: 'date', order: 'desc', significant: 'true', author: '7' });
    expect(Date.parse(query.to!) - Date.parse(query.from!)).toBe(86_400_000 - 1);
    expect(new Date(query.from!).getHours()).toBe(0);
    expect(query).not.toHaveProperty('status');
  });

  it('turns picked dates into days and back in the person’s calendar', () => {
    expect(dayOf(new Date(2026, 0, 5))).toBe('2026-01-05');
    expect(dateOf('2026-01-05')?.getDate()).toBe(5);
    expect(dateOf(null)).toBeNull();
  });

  it('counts the filters in use', () => {
    expect(activeFilterCount(DEFAULT_VIEW)).toBe(0);
    expect(activeFilterCount({ ...DEFAULT_VIEW, page: 4, test: 'g', q: 'x' })).toBe(2);
  });
});

describe('the phone’s sort choices', () => {
  it('are each a sort the API accepts, once', () => {
    const keys = SORT_CHOICES.map((choice) => choice.key);
    expect(new Set(keys).size).toBe(keys.length);
    for (const choice of SORT_CHOICES) expect(viewFromUrl({ sort: choice.sort, order: choice.order })).toMatchObject({ sort: choice.sort, order: choice.order });
  });
});
