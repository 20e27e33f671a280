import { inject, Injectable } from '@angular/core';
import type { NotificationsPage } from '@tallyfit/contracts';
import { catchError, EMPTY, merge, type Observable, shareReplay, Subject, switchMap, timer } from 'rxjs';
import { NotificationsApi } from '../api/notifications-api';

/** How often the bell asks for news when nothing on the page has asked it to. */
export const NOTIFICATIONS_POLL_MS = 30_000;

/**
 * The signed-in person's latest notifications, shared by the bell and the notifications page:
 * polled every 30 s and fetched again at once after anything that may have changed them (a
 * review decision, a notification read).
 */
@Injectable({ providedIn: 'root' })
export class NotificationsCenter {
  private readonly api = inject(NotificationsApi);
  private readonly refreshes = new Subject<void>();

  /**
   * The newest page, while someone subscribes (the app shell, for as long as a person is signed
   * in). A failed poll is skipped: the bell keeps its last count until the next one.
   */
  readonly latest: Observable<NotificationsPage> = merge(timer(0, NOTIFICATIONS_POLL_MS), this.refreshes).pipe(
    switchMap(() => this.api.list(1, 8).pipe(catchError(() => EMPTY))),
    shareReplay({ bufferSize: 1, refCount: true }),
  );

  /** Ask again now (after an action that may have notified someone or read something). */
  refresh(): void {
    this.refreshes.next();
  }
}

export const NO_NOTIFICATIONS: NotificationsPage = { items: [], total: 0, page: 1, pageSize: 8, unreadCount: 0 };
