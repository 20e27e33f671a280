import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { CreateShareRequest, Share } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** Shares over the API: e-mail an analysis (a link and its report) to people; the dialog shows failures. */
@Injectable({ providedIn: 'root' })
export class SharesApi {
  private readonly http = inject(HttpClient);

  share(analysisId: number, request: CreateShareRequest): Observable<Share> {
    return this.http.post<Share>(`/api/v1/analyses/${analysisId}/shares`, request, { context: pageHandlesErrors() });
  }

  list(analysisId: number): Observable<Share[]> {
    return this.http.get<Share[]>(`/api/v1/analyses/${analysisId}/shares`, { context: pageHandlesErrors() });
  }
}
