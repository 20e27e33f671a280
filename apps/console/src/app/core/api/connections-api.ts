import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Connection, ConnectionTestResult, CreateConnectionRequest, UpdateConnectionRequest } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** The team's own databases that scheduled queries read from. Passwords go in and never come back. */
@Injectable({ providedIn: 'root' })
export class ConnectionsApi {
  private readonly http = inject(HttpClient);

  list(): Observable<Connection[]> {
    return this.http.get<Connection[]>('/api/v1/connections', { context: pageHandlesErrors() });
  }

  create(request: CreateConnectionRequest): Observable<Connection> {
    return this.http.post<Connection>('/api/v1/connections', request, { context: pageHandlesErrors() });
  }

  update(id: number, request: UpdateConnectionRequest): Observable<Connection> {
    return this.http.patch<Connection>(`/api/v1/connections/${id}`, request, { context: pageHandlesErrors() });
  }

  remove(id: number): Observable<void> {
    return this.http.delete<void>(`/api/v1/connections/${id}`, { context: pageHandlesErrors() });
  }

  /** Signs in and asks the server its version: the answer says whether the settings work. */
  test(id: number): Observable<ConnectionTestResult> {
    return this.http.post<ConnectionTestResult>(`/api/v1/connections/${id}/test`, {}, { context: pageHandlesErrors() });
  }
}
