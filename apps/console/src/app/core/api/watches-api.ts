import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type {
  AcknowledgeAlertRequest,
  CreateWatchRequest,
  DatasetBatchRequest,
  ListWatchesQuery,
  Page,
  PushBatchResponse,
  UpdateWatchRequest,
  Watch,
  WatchAlert,
  WatchBatch,
  WatchDetail,
} from '@tallyfit/contracts';
import { forkJoin, map, of, switchMap, type Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** The latest batches of a watch, oldest first, and how many it has in all. */
export interface LatestBatches {
  items: WatchBatch[];
  total: number;
}

/** Watches over the API: list, read, create and change one, pause and resume it, its batches and alerts. */
@Injectable({ providedIn: 'root' })
export class WatchesApi {
  private readonly http = inject(HttpClient);

  list(query: ListWatchesQuery = {}): Observable<Page<Watch>> {
    let params = new HttpParams();
    for (const [key, value] of Object.entries(query)) {
      if (value !== undefined && value !== null) params = params.set(key, String(value));
    }
    return this.http.get<Page<Watch>>('/api/v1/watches', { params, context: pageHandlesErrors() });
  }

  get(id: number): Observable<WatchDetail> {
    return this.http.get<WatchDetail>(`/api/v1/watches/${id}`, { context: pageHandlesErrors() });
  }

  /** The form shows a refusal itself, next to the fields. */
  create(request: CreateWatchRequest): Observable<WatchDetail> {
    return this.http.post<WatchDetail>('/api/v1/watches', request, { context: pageHandlesErrors() });
  }

  update(id: number, request: UpdateWatchRequest): Observable<WatchDetail> {
    return this.http.patch<WatchDetail>(`/api/v1/watches/${id}`, request, { context: pageHandlesErrors() });
  }

  pause(id: number): Observable<WatchDetail> {
    return this.http.post<WatchDetail>(`/api/v1/watches/${id}/pause`, {}, { context: pageHandlesErrors() });
  }

  /** `restart` begins a fresh sequential test from the next batch, clearing a standing alarm. */
  resume(id: number, restart: boolean): Observable<WatchDetail> {
    return this.http.post<WatchDetail>(`/api/v1/watches/${id}/resume`, { restart }, { context: pageHandlesErrors() });
  }

  /** One page of batches, oldest first (the order of the sequential test's looks). */
  batches(id: number, page = 1, pageSize = 100): Observable<Page<WatchBatch>> {
    return this.http.get<Page<WatchBatch>>(`/api/v1/watches/${id}/batches`, {
      params: new HttpParams().set('page', page).set('pageSize', pageSize),
      context: pageHandlesErrors(),
    });
  }

  /** The latest `count` batches (at most 100), oldest first, and how many there are in all. */
  latestBatches(id: number, count = 100): Observable<LatestBatches> {
    return this.batches(id, 1, count).pipe(
      switchMap((first) => {
        if (first.total <= count) return of({ items: first.items, total: first.total });
        // The newest batches sit on the last page, which may be short: read the one before it too.
        const last = Math.ceil(first.total / count);
        return forkJoin([this.batches(id, last - 1, count), this.batches(id, last, count)]).pipe(
          map(([before, end]) => ({ items: [...before.items, ...end.items].slice(-count), total: end.total })),
        );
      }),
    );
  }

  /** Appends a dataset uploaded to the watch's study as one batch. */
  appendDataset(id: number, request: DatasetBatchRequest): Observable<PushBatchResponse> {
    return this.http.post<PushBatchResponse>(`/api/v1/watches/${id}/batches/from-dataset`, request, { context: pageHandlesErrors() });
  }

  /** Alerts, newest first, each with its deliveries. */
  alerts(id: number, page = 1, pageSize = 25): Observable<Page<WatchAlert>> {
    return this.http.get<Page<WatchAlert>>(`/api/v1/watches/${id}/alerts`, {
      params: new HttpParams().set('page', page).set('pageSize', pageSize),
      context: pageHandlesErrors(),
    });
  }

  acknowledge(alertId: number, request: AcknowledgeAlertRequest): Observable<WatchAlert> {
    return this.http.post<WatchAlert>(`/api/v1/alerts/${alertId}/acknowledge`, request, { context: pageHandlesErrors() });
  }
}
