import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Observable } from 'rxjs';

export interface ShareRequest {
  /** the addresses the report goes to */
  to: string[];
  message?: string;
}

export interface ShareRecord {
  id: number;
  analysisId: number;
  to: string[];
  sentAt: string;
}

/** Shares over the API: send an analysis's report by e-mail. */
@Injectable({ providedIn: 'root' })
export class SharesApi {
  private readonly http = inject(HttpClient);

  share(analysisId: number, request: ShareRequest): Observable<ShareRecord> {
    return this.http.post<ShareRecord>(`/api/v1/analyses/${analysisId}/shares`, request);
  }
}
