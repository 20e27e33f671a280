import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { AnalysisRecord, AnalysisSummary, CreateAnalysisRequest, Page } from '@tallyfit/contracts';
import { map, type Observable } from 'rxjs';

/** Analyses over the API: run and store one, list one's own, read one. */
@Injectable({ providedIn: 'root' })
export class AnalysesApi {
  private readonly http = inject(HttpClient);

  create(request: CreateAnalysisRequest): Observable<AnalysisRecord> {
    return this.http.post<AnalysisRecord>('/api/v1/analyses', request);
  }

  /** The newest page (up to 100) of the signed-in person's own analyses. */
  listOwn(): Observable<AnalysisSummary[]> {
    return this.http
      .get<Page<AnalysisSummary>>('/api/v1/analyses', { params: { author: 'me', pageSize: 100 } })
      .pipe(map((page) => page.items));
  }

  get(id: number): Observable<AnalysisRecord> {
    return this.http.get<AnalysisRecord>(`/api/v1/analyses/${id}`);
  }
}
