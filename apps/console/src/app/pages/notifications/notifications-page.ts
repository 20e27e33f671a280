import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { notificationSentence, type Notification } from '@tallyfit/contracts';
import { combineLatest, switchMap } from 'rxjs';
import { NotificationsApi } from '../../core/api/notifications-api';
import { NotificationsCenter } from '../../core/notifications/notifications-center';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../core/load/load-state';

const PAGE_SIZE = 20;

/** Every notification of the signed-in person, newest first, paged; each links to its analysis. */
@Component({
  selector: 'tf-notifications-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatPaginatorModule, MatProgressBarModule],
  templateUrl: './notifications-page.html',
  styleUrl: './notifications-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotificationsPage {
  private readonly api = inject(NotificationsApi);
  private readonly center = inject(NotificationsCenter);
  protected readonly pageIndex = signal(0);
  private readonly reload = signal(0);
  protected readonly pageSize = PAGE_SIZE;

  private readonly state = toSignal(
    combineLatest([toObservable(this.pageIndex), toObservable(this.reload)]).pipe(
      switchMap(([index]) => toLoadState(this.api.list(index + 1, PAGE_SIZE))),
    ),
    { initialValue: LOADING },
  );
  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => failureMessage(this.state()));
  protected readonly page = computed(() => loadedValue(this.state()));
  protected readonly sentence = notificationSentence;

  protected turn(event: PageEvent): void {
    this.pageIndex.set(event.pageIndex);
  }

  protected opened(notification: Notification): void {
    if (!notification.readAt) this.api.markRead(notification.id).subscribe(() => this.center.refresh());
  }

  protected markAllRead(): void {
    this.api.markAllRead().subscribe(() => {
      this.center.refresh();
      this.reload.update((count) => count + 1);
    });
  }
}
