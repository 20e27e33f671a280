import { LiveAnnouncer } from '@angular/cdk/a11y';
import { Clipboard } from '@angular/cdk/clipboard';
import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTableModule } from '@angular/material/table';
import type { ApiToken, CreatedApiToken } from '@tallyfit/contracts';
import { combineLatest, filter, switchMap } from 'rxjs';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { TokensApi } from '../../core/api/tokens-api';
import { AuthSession } from '../../core/auth/auth-session';
import { can } from '@tallyfit/contracts';
import { failureMessage, LOADING, loadedValue, toLoadState } from '../../core/load/load-state';
import { ConfirmDialog, type ConfirmData } from '../../shared/confirm-dialog/confirm-dialog';

/**
 * Personal API tokens for pipelines. Everyone manages their own; admins can also see and revoke
 * everyone's. A new token's secret is shown once, right after it is made.
 */
@Component({
  selector: 'tf-tokens-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSlideToggleModule,
    MatTableModule,
  ],
  templateUrl: './tokens-page.html',
  styleUrl: './tokens-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TokensPage {
  private readonly api = inject(TokensApi);
  private readonly dialog = inject(MatDialog);
  private readonly clipboard = inject(Clipboard);
  private readonly announcer = inject(LiveAnnouncer);
  private readonly session = inject(AuthSession);

  protected readonly isAdmin = computed(() => can(this.session.role(), 'people.manage'));
  protected readonly everyone = signal(false);
  private readonly reloads = signal(0);
  private readonly state = toSignal(
    combineLatest([toObservable(this.everyone), toObservable(this.reloads)]).pipe(
      switchMap(([everyone]) => toLoadState(this.api.list(everyone ? 'all' : 'me'))),
    ),
    { initialValue: LOADING },
  );
  protected readonly loading = computed(() => this.state().status === 'loading');
  protected readonly failure = computed(() => failureMessage(this.state()));
  protected readonly tokens = computed(() => loadedValue(this.state()));
  protected readonly columns = computed(() =>
    this.everyone() ? ['name', 'owner', 'hint', 'createdAt', 'lastUsedAt', 'state'] : ['name', 'hint', 'createdAt', 'lastUsedAt', 'state'],
  );

  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(100)]],
  });
  protected readonly creating = signal(false);
  protected readonly createError = signal<string | null>(null);
  /** The token just made, with its secret; gone once the person leaves the page. */
  protected readonly created = signal<CreatedApiToken | null>(null);
  protected readonly copied = signal(false);

  private readonly formDirective = viewChild.required(FormGroupDirective);

  protected create(): void {
    const name = this.form.controls.name.value.trim();
    if (!name || this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.creating.set(true);
    this.createError.set(null);
    this.api.create(name).subscribe({
      next: (token) => {
        this.creating.set(false);
        this.created.set(token);
        this.copied.set(false);
        // resetForm (not reset) also clears the submitted state, so the emptied field is not shown as an error.
        this.formDirective().resetForm({ name: '' });
        this.reloads.update((count) => count + 1);
        void this.announcer.announce(`Token ${token.name} created. Copy it now: it will not be shown again.`);
      },
      error: (error: unknown) => {
        this.creating.set(false);
        this.createError.set(apiErrorMessage(error));
      },
    });
  }

  protected copy(token: CreatedApiToken): void {
    this.copied.set(this.clipboard.copy(token.token));
    void this.announcer.announce(this.copied() ? 'Token copied.' : 'The token could not be copied; select it and copy it by hand.');
  }

  protected mine(token: ApiToken): boolean {
    return token.owner.id === this.session.user()?.id;
  }

  protected revoke(token: ApiToken): void {
    const whose = this.mine(token) ? '' : ` of ${token.owner.name}`;
    this.dialog
      .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, {
        data: {
          title: `Revoke “${token.name}”?`,
          message: `Pipelines using this token${whose} stop working at once. This cannot be undone.`,
          confirm: 'Revoke token',
        },
      })
      .afterClosed()
      .pipe(
        filter((yes) => yes === true),
        switchMap(() => this.api.revoke(token.id)),
      )
      .subscribe(() => {
        this.reloads.update((count) => count + 1);
        if (this.created()?.id === token.id) this.created.set(null);
        void this.announcer.announce(`Token ${token.name} revoked.`);
      });
  }
}
