import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type {
  AnalysisChanges,
  AnalysisRecord,
  AnalysisSummary,
  CreateAnalysisRequest,
  Page,
  RerunAnalysisResponse,
  UpdateAnalysisRequest,
} from '@tallyfit/contracts';
import type { AnalysisSpec } from '@tallyfit/engine';
import { map, of, tap, type Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** Analyses over the API: run and store one, list one's own, read one. */
@Injectable({ providedIn: 'root' })
export class AnalysesApi {
  private readonly http = inject(HttpClient);
  /** What a run or re-run just answered, so the result page opening it next needs no second request. */
  private readonly justStored = new Map<number, AnalysisRecord>();

  /** Runs and stores an analysis; the run step shows a failure itself. */
  create(request: CreateAnalysisRequest): Observable<AnalysisRecord> {
    return this.http
      .post<AnalysisRecord>('/api/v1/analyses', request, { context: pageHandlesErrors() })
      .pipe(tap((analysis) => this.justStored.set(analysis.id, analysis)));
  }

  /** Runs an analysis again as a new version (on today's engine), with its stored spec or a changed one. */
  rerun(id: number, spec?: AnalysisSpec): Observable<RerunAnalysisResponse> {
    return this.http
      .post<RerunAnalysisResponse>(`/api/v1/analyses/${id}/rerun`, spec ? { spec } : {}, { context: pageHandlesErrors() })
      .pipe(tap(({ analysis }) => this.justStored.set(analysis.id, analysis)));
  }

  /** What a version changed against the one it re-ran (null for a first version); the page shows it after a reload too. */
  changes(id: number): Observable<AnalysisChanges | null> {
    return this.http.get<AnalysisChanges | null>(`/api/v1/analyses/${id}/changes`, { context: pageHandlesErrors() });
  }

  /** The newest page (up to 100) of the signed-in person's own analyses. */
  listOwn(): Observable<AnalysisSummary[]> {
    return this.http
      .get<Page<AnalysisSummary>>('/api/v1/analyses', { params: { author: 'me', pageSize: 100 } })
      .pipe(map((page) => page.items));
  }

  /** The analyses waiting for review, oldest first (up to 100): a lead's queue. */
  listInReview(): Observable<AnalysisSummary[]> {
    return this.http
      .get<Page<AnalysisSummary>>('/api/v1/analyses', { params: { status: 'in_review', sort: 'date', order: 'asc', pageSize: 100 } })
      .pipe(map((page) => page.items));
  }

  /** Edits the title or notes; the result stays as it was. */
  update(id: number, changes: UpdateAnalysisRequest): Observable<AnalysisRecord> {
    return this.http.patch<AnalysisRecord>(`/api/v1/analyses/${id}`, changes, { context: pageHandlesErrors() });
  }

  /** Deletes the analysis with all its versions (the audit trail keeps the record). */
  delete(id: number): Observable<void> {
    return this.http.delete<void>(`/api/v1/analyses/${id}`, { context: pageHandlesErrors() });
  }

  /** One analysis: the one just stored if it is that, else from the API (a reload always asks the API). */
  get(id: number): Observable<AnalysisRecord> {
    const stored = this.justStored.get(id);
    if (stored) {
      this.justStored.delete(id);
      return of(stored);
    }
    return this.http.get<AnalysisRecord>(`/api/v1/analyses/${id}`, { context: pageHandlesErrors() });
  }
}
