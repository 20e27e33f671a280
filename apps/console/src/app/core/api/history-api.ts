import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { AnalysisSummary, ListAnalysesQuery, Page } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** The team history: one page of every analysis the caller may read, sorted and filtered by the API. */
@Injectable({ providedIn: 'root' })
export class HistoryApi {
  private readonly http = inject(HttpClient);

  list(query: ListAnalysesQuery): Observable<Page<AnalysisSummary>> {
    let params = new HttpParams();
    for (const [name, value] of Object.entries(query)) {
      if (value !== undefined && value !== null && value !== '') params = params.set(name, String(value));
    }
    return this.http.get<Page<AnalysisSummary>>('/api/v1/analyses', { params, context: pageHandlesErrors() });
  }
}
