import { LiveAnnouncer } from '@angular/cdk/a11y';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { Connection, ConnectionTestResult } from '@tallyfit/contracts';
import { switchMap } from 'rxjs';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { ConnectionsApi } from '../../core/api/connections-api';
import { AuthSession } from '../../core/auth/auth-session';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../core/load/load-state';
import { ConfirmDialog, type ConfirmData } from '../../shared/confirm-dialog/confirm-dialog';
import { ConnectionFormDialog } from './connection-form-dialog';

/** The team's own databases that scheduled queries read from: list, connect, try, change, remove. */
@Component({
  selector: 'tf-connections-page',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './connections-page.html',
  styleUrl: './connections-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConnectionsPage {
  private readonly api = inject(ConnectionsApi);
  private readonly dialog = inject(MatDialog);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly user = inject(AuthSession).user;

  private readonly reloads = signal(0);
  private readonly state = toSignal(toObservable(this.reloads).pipe(switchMap(() => toLoadState(this.api.list()))), { initialValue: LOADING });
  protected readonly connections = computed(() => loadedValue(this.state()));
  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => failureMessage(this.state()));
  /** The last try of each connection, by id. */
  protected readonly tries = signal<Record<number, ConnectionTestResult | 'trying'>>({});

  /** The API lets a connection's creator and admins change it. */
  protected changes(connection: Connection): boolean {
    const user = this.user();
    return !!user && (user.role === 'admin' || connection.createdBy.id === user.id);
  }

  protected add(): void {
    this.openForm(null);
  }

  protected edit(connection: Connection): void {
    this.openForm(connection);
  }

  protected tryConnection(connection: Connection): void {
    this.tries.update((tries) => ({ ...tries, [connection.id]: 'trying' }));
    this.api.test(connection.id).subscribe({
      next: (result) => {
        this.tries.update((tries) => ({ ...tries, [connection.id]: result }));
        void this.announcer.announce(`${connection.name}: ${result.message}`);
      },
      error: (error: unknown) => {
        const result = { ok: false, message: apiErrorMessage(error), elapsedMs: 0 };
        this.tries.update((tries) => ({ ...tries, [connection.id]: result }));
      },
    });
  }

  protected remove(connection: Connection): void {
    this.dialog
      .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, {
        data: {
          title: `Remove “${connection.name}”?`,
          message: 'Watches that query it stop getting counts until they are given another database.',
          confirm: 'Remove',
        },
      })
      .afterClosed()
      .subscribe((confirmed) => {
        if (!confirmed) return;
        this.api.remove(connection.id).subscribe({
          next: () => {
            void this.announcer.announce(`${connection.name} removed.`);
            this.reloads.update((count) => count + 1);
          },
          error: (error: unknown) => void this.announcer.announce(apiErrorMessage(error), 'assertive'),
        });
      });
  }

  private openForm(connection: Connection | null): void {
    this.dialog
      .open<ConnectionFormDialog, Connection | null, Connection>(ConnectionFormDialog, { data: connection, width: '560px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        void this.announcer.announce(`${saved.name} saved.`);
        this.reloads.update((count) => count + 1);
      });
  }
}
