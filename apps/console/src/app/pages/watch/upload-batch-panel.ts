import { LiveAnnouncer } from '@angular/cdk/a11y';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { PushBatchResponse, Watch } from '@tallyfit/contracts';
import { apiErrorMessage } from '../../core/api/api-error-message';
import { WatchesApi } from '../../core/api/watches-api';
import { DatasetUpload, type DatasetCounts } from '../new-analysis/data-step/dataset-upload';
import { defaultUploadPeriod, periodFromInputs } from './upload-period';

/**
 * Adds an uploaded file to an upload-fed watch as one batch: the file goes into the watch's study
 * (the new-analysis flow's upload and column choice), then its counts are appended for a period.
 */
@Component({
  selector: 'tf-upload-batch-panel',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, DatasetUpload],
  template: `
    <div class="period">
      <mat-form-field appearance="outline">
        <mat-label>Period from</mat-label>
        <input matInput type="datetime-local" [ngModel]="start()" (ngModelChange)="start.set($event)" name="periodStart" />
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>Period to</mat-label>
        <input matInput type="datetime-local" [ngModel]="end()" (ngModelChange)="end.set($event)" name="periodEnd" />
      </mat-form-field>
    </div>
    <tf-dataset-upload [studyId]="watch().study.id" (countsChange)="chosen.set($event)" />
    @if (chosen(); as counts) {
      <div class="add">
        <button mat-flat-button type="button" [disabled]="busy()" (click)="append(counts)">
          <mat-icon aria-hidden="true">playlist_add</mat-icon>
          Add {{ counts.datasetName }} as batch {{ watch().batchCount + 1 }}
        </button>
      </div>
    }
    @if (busy()) {
      <mat-progress-bar mode="indeterminate" aria-label="Adding the batch" />
    }
    @if (problem(); as message) {
      <p class="problem" role="alert">{{ message }}</p>
    }
  `,
  styles: `
    :host { display: flex; flex-direction: column; gap: 8px; }
    .period { display: flex; flex-wrap: wrap; gap: 8px 16px; }
    .period mat-form-field { flex: 1 1 220px; max-width: 320px; }
    .problem { color: var(--mat-sys-error); margin: 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadBatchPanel {
  private readonly api = inject(WatchesApi);
  private readonly announcer = inject(LiveAnnouncer);

  readonly watch = input.required<Watch>();
  /** the batch was taken in; the page asks for the watch again */
  readonly appended = output<PushBatchResponse>();

  private readonly period = computed(() => defaultUploadPeriod(this.watch().lastPeriodEnd, new Date()));
  protected readonly start = linkedSignal(() => this.period().start);
  protected readonly end = linkedSignal(() => this.period().end);
  protected readonly chosen = signal<DatasetCounts | null>(null);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected append(counts: DatasetCounts): void {
    const period = periodFromInputs(this.start(), this.end());
    if (!period.ok) {
      this.problem.set(period.error);
      return;
    }
    this.busy.set(true);
    this.problem.set(null);
    this.api
      .appendDataset(this.watch().id, { datasetId: counts.datasetId, selection: counts.selection, periodStart: period.periodStart, periodEnd: period.periodEnd })
      .subscribe({
        next: (response) => {
          this.busy.set(false);
          void this.announcer.announce(
            response.created ? `Added as batch ${response.batch.sequence}.` : `This file was already added, as batch ${response.batch.sequence}; it is counted once.`,
          );
          this.appended.emit(response);
        },
        error: (error: unknown) => {
          this.busy.set(false);
          this.problem.set(apiErrorMessage(error));
        },
      });
  }
}
