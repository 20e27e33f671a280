import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import type { Notification, NotificationsPage } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { pageHandlesErrors } from '../notify/page-handles-errors';

/** The signed-in person's notifications of review decisions. */
@Injectable({ providedIn: 'root' })
export class NotificationsApi {
  private readonly http = inject(HttpClient);

  /** One page, newest first, with the unread count. Quiet on failure: the bell simply keeps its last count. */
  list(page = 1, pageSize = 20): Observable<NotificationsPage> {
    return this.http.get<NotificationsPage>('/api/v1/notifications', { params: { page, pageSize }, context: pageHandlesErrors() });
  }

  markRead(id: number): Observable<Notification> {
    return this.http.post<Notification>(`/api/v1/notifications/${id}/read`, {}, { context: pageHandlesErrors() });
  }

  markAllRead(): Observable<{ marked: number }> {
    return this.http.post<{ marked: number }>('/api/v1/notifications/read-all', {}, { context: pageHandlesErrors() });
  }
}
