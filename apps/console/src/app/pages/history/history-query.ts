import { HISTORY_SORTS, listAnalysesQuerySchema, type AnalysisStatus, type ListAnalysesQuery } from '@tallyfit/contracts';
import type { TestName } from '@tallyfit/engine';
import type { z } from 'zod';

export type HistorySort = (typeof HISTORY_SORTS)[number];
export type { TestName } from '@tallyfit/engine';

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

/** The URL's day format (the picker's), a narrower form of the API's ISO 8601 dates. */
const DAY = /^\d{4}-\d{2}-\d{2}$/;

const queryFields = listAnalysesQuerySchema.shape;

/**
 * One URL value read with the API's own schema for that query field, or null where the API would
 * refuse it (or where it is absent and the field has no default).
 */
function checked<K extends keyof typeof queryFields>(
  key: K,
  text: string | undefined,
): Exclude<z.output<(typeof queryFields)[K]>, undefined> | null {
  const parsed = queryFields[key].safeParse(text);
  return parsed.success && parsed.data !== undefined ? (parsed.data as Exclude<z.output<(typeof queryFields)[K]>, undefined>) : null;
}

/** Reads a view from the URL; a hand-edited or stale link falls back to defaults rather than failing. */
export function viewFromUrl(params: HistoryUrlParams): HistoryView {
  const pageSize = checked('pageSize', params.pageSize);
  const day = (text: string | undefined) => (text && DAY.test(text) && checked('from', text) !== null ? text : null);
  return {
    page: checked('page', params.page) ?? 1,
    pageSize: pageSize !== null && (PAGE_SIZES as readonly number[]).includes(pageSize) ? pageSize : DEFAULT_VIEW.pageSize,
    sort: checked('sort', params.sort) ?? DEFAULT_VIEW.sort,
    order: checked('order', params.order) ?? DEFAULT_VIEW.order,
    studyId: checked('studyId', params.studyId),
    author: checked('author', params.author),
    test: checked('test', params.test),
    status: checked('status', params.status),
    significant: checked('significant', params.significant),
    from: day(params.from),
    to: day(params.to),
    q: checked('q', params.q),
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
