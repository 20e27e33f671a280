import { HttpClient, HttpParams } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { ApiToken, CreatedApiToken } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** Whose tokens to list: one's own, everyone's (admins), or one person's (admins). */
export type TokenOwner = 'me' | 'all' | number;

/** Personal API tokens for pipelines: list (never the secret), create (the secret once), revoke. */
@Injectable({ providedIn: 'root' })
export class TokensApi {
  private readonly http = inject(HttpClient);

  list(owner: TokenOwner = 'me'): Observable<ApiToken[]> {
    return this.http.get<ApiToken[]>('/api/v1/tokens', {
      params: new HttpParams().set('owner', String(owner)),
      context: pageHandlesErrors(),
    });
  }

  create(name: string): Observable<CreatedApiToken> {
    return this.http.post<CreatedApiToken>('/api/v1/tokens', { name }, { context: pageHandlesErrors() });
  }

  revoke(id: number): Observable<ApiToken> {
    return this.http.delete<ApiToken>(`/api/v1/tokens/${id}`);
  }
}
