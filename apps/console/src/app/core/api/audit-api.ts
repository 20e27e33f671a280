import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { AuditEvent, ListAuditQuery, Page } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** The audit trail, newest first, one filtered page at a time. */
@Injectable({ providedIn: 'root' })
export class AuditApi {
  private readonly http = inject(HttpClient);

  list(query: Partial<ListAuditQuery>): Observable<Page<AuditEvent>> {
    let params = new HttpParams();
    for (const [name, value] of Object.entries(query)) {
      if (value !== undefined && value !== null && value !== '') params = params.set(name, String(value));
    }
    return this.http.get<Page<AuditEvent>>('/api/v1/audit', { params, context: pageHandlesErrors() });
  }
}
