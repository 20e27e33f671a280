import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { WatchAlert } from '@tallyfit/contracts';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { WatchesApi } from '../../core/api/watches-api';

export interface AcknowledgeDialogData {
  watchId: number;
  watchName: string;
  alert: WatchAlert;
}

/** A lead acknowledges an alarm with a note saying what was found; the dialog closes with the acknowledged alert. */
@Component({
  selector: 'tf-acknowledge-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule],
  template: `
    <h2 mat-dialog-title>Acknowledge the alarm on “{{ data.watchName }}”</h2>
    <form [formGroup]="form" (ngSubmit)="acknowledge()" novalidate>
      <mat-dialog-content>
        <p>The alarm stays in the history with your name and note. The watch keeps testing the batches that follow.</p>
        <mat-form-field appearance="outline" class="wide">
          <mat-label>Note</mat-label>
          <textarea matInput formControlName="note" rows="4" cdkFocusInitial></textarea>
          <mat-hint>What was found and what is being done, for whoever looks next.</mat-hint>
          @if (note.hasError('maxlength')) {
            <mat-error>At most 2000 characters.</mat-error>
          }
        </mat-form-field>
        @if (problem(); as message) {
          <p class="problem" role="alert">{{ message }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close>Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy()">Acknowledge</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .wide { width: 100%; }
    .problem { color: var(--mat-sys-error); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcknowledgeDialog {
  private readonly api = inject(WatchesApi);
  private readonly ref = inject<MatDialogRef<AcknowledgeDialog, WatchAlert>>(MatDialogRef);
  protected readonly data = inject<AcknowledgeDialogData>(MAT_DIALOG_DATA);

  protected readonly note = new FormControl('', { nonNullable: true, validators: [Validators.maxLength(2000)] });
  protected readonly form = new FormGroup({ note: this.note });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected acknowledge(): void {
    if (this.note.invalid) return;
    this.busy.set(true);
    this.problem.set(null);
    const note = this.note.value.trim();
    this.api.acknowledge(this.data.alert.id, note ? { note } : {}).subscribe({
      next: (alert) => this.ref.close(alert),
      error: (error: unknown) => {
        this.busy.set(false);
        this.problem.set(apiErrorMessage(error));
      },
    });
  }
}
