import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { AnalysisChanges, AnalysisRecord, AnalysisSummary, CreateAnalysisRequest, Page, RerunAnalysisResponse } from '@tallyfit/contracts';
import type { AnalysisSpec } from '@tallyfit/engine';
import { map, type Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** Analyses over the API: run and store one, list one's own, read one. */
@Injectable({ providedIn: 'root' })
export class AnalysesApi {
  private readonly http = inject(HttpClient);

  /** Runs and stores an analysis; the run step shows a failure itself. */
  create(request: CreateAnalysisRequest): Observable<AnalysisRecord> {
    return this.http.post<AnalysisRecord>('/api/v1/analyses', request, { context: pageHandlesErrors() });
  }

  /** Runs an analysis again as a new version (on today's engine), with its stored spec or a changed one. */
  rerun(id: number, spec?: AnalysisSpec): Observable<RerunAnalysisResponse> {
    return this.http.post<RerunAnalysisResponse>(`/api/v1/analyses/${id}/rerun`, spec ? { spec } : {}, { context: pageHandlesErrors() });
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

  get(id: number): Observable<AnalysisRecord> {
    return this.http.get<AnalysisRecord>(`/api/v1/analyses/${id}`, { context: pageHandlesErrors() });
  }
}
