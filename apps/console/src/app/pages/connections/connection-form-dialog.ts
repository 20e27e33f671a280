import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { Connection } from '@tallyfit/contracts';
import type { Observable } from 'rxjs';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { ConnectionsApi } from '../../core/api/connections-api';
import { createConnectionFrom, draftFromConnection, EMPTY_CONNECTION, updateConnectionFrom } from './connection-draft';

/** Adds a team database, or changes one (`data` is the stored connection); closes with the saved connection. */
@Component({
  selector: 'tf-connection-form-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatCheckboxModule, MatDialogModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>{{ data ? 'Change “' + data.name + '”' : 'Connect a database' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <p class="how">A PostgreSQL database that watches query on a schedule. Give it an account that can only read.</p>
        <mat-form-field appearance="outline" class="wide">
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" autocomplete="off" cdkFocusInitial />
        </mat-form-field>
        <div class="row">
          <mat-form-field appearance="outline" class="grow">
            <mat-label>Host</mat-label>
            <input matInput formControlName="host" autocomplete="off" />
          </mat-form-field>
          <mat-form-field appearance="outline" class="port">
            <mat-label>Port</mat-label>
            <input matInput type="number" formControlName="port" />
          </mat-form-field>
        </div>
        <div class="row">
          <mat-form-field appearance="outline" class="grow">
            <mat-label>Database</mat-label>
            <input matInput formControlName="database" autocomplete="off" />
          </mat-form-field>
          <mat-form-field appearance="outline" class="grow">
            <mat-label>User</mat-label>
            <input matInput formControlName="user" autocomplete="off" />
          </mat-form-field>
        </div>
        <mat-form-field appearance="outline" class="wide">
          <mat-label>Password</mat-label>
          <input matInput type="password" formControlName="password" autocomplete="new-password" />
          <mat-hint>{{ data?.hasPassword ? 'Leave empty to keep the stored password.' : 'Stored encrypted; it is never shown again.' }}</mat-hint>
        </mat-form-field>
        <mat-checkbox formControlName="ssl">Connect with TLS</mat-checkbox>
        @if (errors().length > 0) {
          <ul class="problems" role="alert">
            @for (message of errors(); track $index) {
              <li>{{ message }}</li>
            }
          </ul>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy()">{{ data ? 'Save changes' : 'Connect' }}</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .fields { display: flex; flex-direction: column; gap: 4px; }
    .how { margin-top: 0; color: var(--mat-sys-on-surface-variant); }
    .wide { width: 100%; }
    .row { display: flex; flex-wrap: wrap; gap: 0 12px; }
    .grow { flex: 1 1 200px; }
    .port { flex: 0 1 120px; }
    .problems { color: var(--mat-sys-error); padding-inline-start: 20px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConnectionFormDialog {
  private readonly api = inject(ConnectionsApi);
  private readonly ref = inject<MatDialogRef<ConnectionFormDialog, Connection>>(MatDialogRef);
  protected readonly data = inject<Connection | null>(MAT_DIALOG_DATA, { optional: true });

  protected readonly form = inject(NonNullableFormBuilder).group({
    ...(this.data ? draftFromConnection(this.data) : EMPTY_CONNECTION),
    port: [this.data?.port ?? EMPTY_CONNECTION.port] as [number | null],
  });
  protected readonly errors = signal<string[]>([]);
  protected readonly busy = signal(false);

  protected save(): void {
    const draft = this.form.getRawValue();
    let request: Observable<Connection>;
    if (this.data) {
      const outcome = updateConnectionFrom(this.data, draft);
      if (!outcome.ok) return this.errors.set(outcome.errors);
      request = this.api.update(this.data.id, outcome.request);
    } else {
      const outcome = createConnectionFrom(draft);
      if (!outcome.ok) return this.errors.set(outcome.errors);
      request = this.api.create(outcome.request);
    }
    this.errors.set([]);
    this.busy.set(true);
    request.subscribe({
      next: (connection) => this.ref.close(connection),
      error: (error: unknown) => {
        this.busy.set(false);
        this.errors.set([apiErrorMessage(error)]);
      },
    });
  }
}
