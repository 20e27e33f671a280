import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { AnalysisRecord, AnalysisSummary, CreateAnalysisRequest } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';

/** Analyses over the API: run and store one, list one's own, read one. */
@Injectable({ providedIn: 'root' })
export class AnalysesApi {
  private readonly http = inject(HttpClient);

  create(request: CreateAnalysisRequest): Observable<AnalysisRecord> {
    return this.http.post<AnalysisRecord>('/api/v1/analyses', request);
  }

  listOwn(): Observable<AnalysisSummary[]> {
    return this.http.get<AnalysisSummary[]>('/api/v1/analyses');
  }

  get(id: number): Observable<AnalysisRecord> {
    return this.http.get<AnalysisRecord>(`/api/v1/analyses/${id}`);
  }
}
