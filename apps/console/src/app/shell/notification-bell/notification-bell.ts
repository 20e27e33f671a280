import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatBadgeModule } from '@angular/material/badge';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { Router, RouterLink } from '@angular/router';
import { notificationSentence, type Notification, type NotificationsPage } from '@tallyfit/contracts';
import { NotificationsApi } from '../../core/api/notifications-api';
import { NotificationsCenter } from '../../core/notifications/notifications-center';
import { badgeText, bellLabel } from './bell-words';

/** The bell in the toolbar: the unread count, and a menu of the newest notifications linking to their analyses. */
@Component({
  selector: 'tf-notification-bell',
  imports: [DatePipe, RouterLink, MatBadgeModule, MatButtonModule, MatIconModule, MatMenuModule],
  templateUrl: './notification-bell.html',
  styleUrl: './notification-bell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotificationBell {
  private readonly api = inject(NotificationsApi);
  private readonly center = inject(NotificationsCenter);
  private readonly router = inject(Router);

  readonly page = input.required<NotificationsPage>();
  protected readonly unread = computed(() => this.page().unreadCount);
  protected readonly badge = computed(() => badgeText(this.unread()));
  protected readonly label = computed(() => bellLabel(this.unread()));
  protected readonly sentence = notificationSentence;

  protected open(notification: Notification): void {
    const go = () => void this.router.navigate(['/analyses', notification.analysis.id]);
    if (notification.readAt) {
      go();
      return;
    }
    this.api.markRead(notification.id).subscribe({ next: () => this.center.refresh(), complete: go, error: go });
  }

  protected markAllRead(): void {
    this.api.markAllRead().subscribe(() => this.center.refresh());
  }
}
