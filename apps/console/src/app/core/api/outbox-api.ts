import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Outbox } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** What the built-in mail stand-in received (admins only). */
@Injectable({ providedIn: 'root' })
export class OutboxApi {
  private readonly http = inject(HttpClient);

  get(): Observable<Outbox> {
    return this.http.get<Outbox>('/api/v1/outbox', { context: pageHandlesErrors() });
  }
}
