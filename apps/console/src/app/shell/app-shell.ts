import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatToolbarModule } from '@angular/material/toolbar';
import { NavigationEnd, Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { filter, map } from 'rxjs';
import { AuthSession } from '../core/auth/auth-session';
import { NO_NOTIFICATIONS, NotificationsCenter } from '../core/notifications/notifications-center';
import { NotificationBell } from './notification-bell/notification-bell';
import { ADMIN_NAV, MAIN_NAV, visibleTo } from './nav-items';

/** Below this width the places fold into a menu, so the toolbar stays one line on a phone. */
const COMPACT_QUERY = '(max-width: 959.98px)';

/** The frame around every signed-in page: the product's name, the places a role can use, and who is signed in. */
@Component({
  selector: 'tf-app-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatToolbarModule, MatButtonModule, MatIconModule, MatMenuModule, NotificationBell],
  templateUrl: './app-shell.html',
  styleUrl: './app-shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AppShell {
  private readonly session = inject(AuthSession);
  private readonly router = inject(Router);
  protected readonly user = this.session.user;
  /** Polled for as long as the shell is shown, that is while someone is signed in. */
  protected readonly notifications = toSignal(inject(NotificationsCenter).latest, { initialValue: NO_NOTIFICATIONS });
  protected readonly mainNav = computed(() => visibleTo(MAIN_NAV, this.session.role()));
  protected readonly adminNav = computed(() => visibleTo(ADMIN_NAV, this.session.role()));
  protected readonly compact = toSignal(
    inject(BreakpointObserver)
      .observe(COMPACT_QUERY)
      .pipe(map((state) => state.matches)),
    { initialValue: false },
  );
  private readonly url = toSignal(
    this.router.events.pipe(
      filter((event) => event instanceof NavigationEnd),
      map(() => this.router.url),
    ),
    { initialValue: this.router.url },
  );
  protected readonly inAdmin = computed(() => this.url().startsWith('/admin'));

  /** Moves focus into the page itself; a plain `#main` link would be taken by the router as a navigation. */
  protected skipToContent(event: Event): void {
    event.preventDefault();
    document.getElementById('main')?.focus();
  }

  protected signOut(): void {
    this.session.signOut({ revoke: true });
    void this.router.navigate(['/sign-in']);
  }
}
