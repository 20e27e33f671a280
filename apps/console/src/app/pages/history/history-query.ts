import { ANALYSIS_STATUSES, HISTORY_SORTS, type AnalysisStatus, type ListAnalysesQuery } from '@tallyfit/contracts';
import { testNames } from '@tallyfit/engine';

export type HistorySort = (typeof HISTORY_SORTS)[number];
export type TestName = (typeof testNames)[number];

/** The history's view as the URL holds it: every value is optional text from the query string. */
export interface HistoryUrlParams {
  page?: string;
  pageSize?: string;
  sort?: string;
  order?: string;
  studyId?: string;
  author?: string;
  test?: string;
  status?: string;
  significant?: string;
  from?: string;
  to?: string;
  q?: string;
}

/** The same view, checked: anything the URL holds that the API would refuse is left out. */
export interface HistoryView {
  page: number;
  pageSize: number;
  sort: HistorySort;
  order: 'asc' | 'desc';
  studyId: number | null;
  author: string | null;
  test: TestName | null;
  status: AnalysisStatus | null;
  significant: boolean | null;
  /** Calendar days, `YYYY-MM-DD`. */
  from: string | null;
  to: string | null;
  q: string | null;
}

export const PAGE_SIZES = [10, 25, 50, 100] as const;
export const DEFAULT_VIEW: HistoryView = {
  page: 1,
  pageSize: 25,
  sort: 'date',
  order: 'desc',
  studyId: null,
  author: null,
  test: null,
  status: null,
  significant: null,
  from: null,
  to: null,
  q: null,
};

const DAY = /^\d{4}-\d{2}-\d{2}$/;

/** Reads a view from the URL; a hand-edited or stale link falls back to defaults rather than failing. */
export function viewFromUrl(params: HistoryUrlParams): HistoryView {
  const whole = (text: string | undefined) => (text && /^[1-9]\d*$/.test(text) ? Number(text) : null);
  const oneOf = <T extends string>(text: string | undefined, allowed: readonly T[]): T | null =>
    allowed.includes(text as T) ? (text as T) : null;
  const pageSize = whole(params.pageSize);
  return {
    page: whole(params.page) ?? 1,
    pageSize: pageSize !== null && (PAGE_SIZES as readonly number[]).includes(pageSize) ? pageSize : DEFAULT_VIEW.pageSize,
    sort: oneOf(params.sort, HISTORY_SORTS) ?? DEFAULT_VIEW.sort,
    order: oneOf(params.order, ['asc', 'desc'] as const) ?? DEFAULT_VIEW.order,
    studyId: whole(params.studyId),
    author: params.author === 'me' || whole(params.author) !== null ? (params.author as string) : null,
    test: oneOf(params.test, testNames),
    status: oneOf(params.status, ANALYSIS_STATUSES),
    significant: params.significant === 'true' ? true : params.significant === 'false' ? false : null,
    from: params.from && DAY.test(params.from) ? params.from : null,
    to: params.to && DAY.test(params.to) ? params.to : null,
    q: params.q?.trim() ? params.q.trim().slice(0, 200) : null,
  };
}

/** The query params for a view, leaving out defaults so links stay short. */
export function urlFromView(view: HistoryView): Record<string, string | null> {
  const params: Record<string, string | null> = {};
  for (const key of Object.keys(DEFAULT_VIEW) as (keyof HistoryView)[]) {
    const value = view[key];
    params[key] = value === null || value === DEFAULT_VIEW[key] ? null : String(value);
  }
  return params;
}

/** The API query for a view. A day range covers whole days in the person's own time zone, as dates are shown. */
export function apiQueryFromView(view: HistoryView): ListAnalysesQuery {
  const query: ListAnalysesQuery = { page: view.page, pageSize: view.pageSize, sort: view.sort, order: view.order };
  if (view.studyId !== null) query.studyId = String(view.studyId);
  if (view.author !== null) query.author = view.author;
  if (view.test !== null) query.test = view.test;
  if (view.status !== null) query.status = view.status;
  if (view.significant !== null) query.significant = view.significant ? 'true' : 'false';
  if (view.from !== null) query.from = localDayStart(view.from).toISOString();
  if (view.to !== null) query.to = new Date(localDayStart(view.to).getTime() + 86_400_000 - 1).toISOString();
  if (view.q !== null) query.q = view.q;
  return query;
}

/** How many filters narrow the view (page and sort do not count). */
export function activeFilterCount(view: HistoryView): number {
  const filters: (keyof HistoryView)[] = ['studyId', 'author', 'test', 'status', 'significant', 'from', 'to', 'q'];
  return filters.filter((key) => view[key] !== null).length;
}

function localDayStart(day: string): Date {
  const [year, month, date] = day.split('-').map(Number);
  return new Date(year, month - 1, date);
}

/** A picked date as the URL's `YYYY-MM-DD`, in the person's own calendar. */
export function dayOf(date: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/** The URL's `YYYY-MM-DD` as a date for the picker. */
export function dateOf(day: string | null): Date | null {
  return day ? localDayStart(day) : null;
}

/** Sort choices as one list, for the phone layout where column headers are not shown. */
export const SORT_CHOICES: ReadonlyArray<{ key: string; words: string; sort: HistorySort; order: 'asc' | 'desc' }> = [
  { key: 'date-desc', words: 'Newest first', sort: 'date', order: 'desc' },
  { key: 'date-asc', words: 'Oldest first', sort: 'date', order: 'asc' },
  { key: 'p-asc', words: 'Smallest p first', sort: 'p', order: 'asc' },
  { key: 'study-asc', words: 'Study, A to Z', sort: 'study', order: 'asc' },
  { key: 'author-asc', words: 'Run by, A to Z', sort: 'author', order: 'asc' },
  { key: 'status-asc', words: 'Review state', sort: 'status', order: 'asc' },
];
