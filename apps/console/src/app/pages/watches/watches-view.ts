/**
 * The Watches page's view as the address holds it (so a filtered list can be bookmarked), the API
 * query it asks for, and each row's figures in words.
 */
import { WATCH_STATES, type ListWatchesQuery, type Watch, type WatchState } from '@tallyfit/contracts';
import { formatP } from '../../core/format/p-value';

export interface WatchesUrlParams {
  page?: string;
  studyId?: string;
  state?: string;
  waiting?: string;
  q?: string;
}

export interface WatchesView {
  page: number;
  studyId: number | null;
  state: WatchState | null;
  /** only watches whose alarm waits for a lead */
  waiting: boolean;
  q: string | null;
}

export const WATCHES_PAGE_SIZE = 25;

/** Reads the view from the address; anything the API would refuse falls back to the default. */
export function watchesViewFromUrl(params: WatchesUrlParams): WatchesView {
  const whole = (text: string | undefined) => (text && /^[1-9]\d*$/.test(text) ? Number(text) : null);
  return {
    page: whole(params.page) ?? 1,
    studyId: whole(params.studyId),
    state: WATCH_STATES.includes(params.state as WatchState) ? (params.state as WatchState) : null,
    waiting: params.waiting === 'true',
    q: params.q?.trim() ? params.q.trim().slice(0, 200) : null,
  };
}

/** The query params for a view, leaving out defaults so links stay short. */
export function urlFromWatchesView(view: WatchesView): Record<string, string | null> {
  return {
    page: view.page === 1 ? null : String(view.page),
    studyId: view.studyId === null ? null : String(view.studyId),
    state: view.state,
    waiting: view.waiting ? 'true' : null,
    q: view.q,
  };
}

export function apiQueryFromWatchesView(view: WatchesView): ListWatchesQuery {
  const query: ListWatchesQuery = { page: view.page, pageSize: WATCHES_PAGE_SIZE };
  if (view.studyId !== null) query.studyId = String(view.studyId);
  if (view.state !== null) query.state = view.state;
  if (view.waiting) query.waiting = 'true';
  if (view.q !== null) query.q = view.q;
  return query;
}

export function watchesFilterCount(view: WatchesView): number {
  return [view.studyId !== null, view.state !== null, view.waiting, view.q !== null].filter(Boolean).length;
}

/** The sequential p beside alpha, e.g. "p = .003 (alpha 0.05)"; nothing to say before the first batch. */
export function sequentialPText(watch: Pick<Watch, 'batchCount' | 'sequentialP' | 'alpha'>): string {
  if (watch.batchCount === 0) return 'No batches yet';
  return `p ${formatP(watch.sequentialP)} (alpha ${watch.alpha})`;
}

/** How much the watch has taken in, e.g. "12 batches · 240,000 observations". */
export function intakeText(watch: Pick<Watch, 'batchCount' | 'n'>): string {
  const batches = watch.batchCount === 1 ? '1 batch' : `${watch.batchCount.toLocaleString('en-US')} batches`;
  const observations = watch.n === 1 ? '1 observation' : `${watch.n.toLocaleString('en-US')} observations`;
  return `${batches} · ${observations}`;
}
