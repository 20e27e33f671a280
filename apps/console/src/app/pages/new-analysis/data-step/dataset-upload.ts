import { DecimalPipe, PercentPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { CategoryCounts, CountSelection, DatasetRecord } from '@tallyfit/contracts';
import { of, type Subscription } from 'rxjs';
import { apiErrorMessage } from '../../../core/api/api-error-message';
import { DatasetsApi } from '../../../core/api/datasets-api';
import { ColumnPicker } from './column-picker';
import { SegmentChoicePicker, type SegmentChoice } from './segment-choice';
import type { ParsedCounts } from './pasted-counts';
import { ACCEPTED_EXTENSIONS, uploadFileProblem } from './upload-file-check';

/** The counts taken from an uploaded dataset, and which dataset they came from. */
export interface DatasetCounts {
  datasetId: number;
  datasetName: string;
  selection: CountSelection;
  counts: ParsedCounts;
  /** a second column to split the counts by, when one was chosen */
  segments?: SegmentChoice;
}

type UploadState =
  | { step: 'idle' }
  | { step: 'sending'; fileName: string; fraction: number | null }
  | { step: 'stored'; dataset: DatasetRecord };

const sameSelection = (a: CountSelection, b: CountSelection): boolean => JSON.stringify(a) === JSON.stringify(b);

/**
 * Upload a file into a study (drag it in or pick it), watching the real upload progress, then
 * choose which columns hold the categories and see the counts before anything is run.
 */
@Component({
  selector: 'tf-dataset-upload',
  imports: [DecimalPipe, PercentPipe, MatButtonModule, MatIconModule, MatProgressBarModule, ColumnPicker, SegmentChoicePicker],
  templateUrl: './dataset-upload.html',
  styleUrl: './dataset-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DatasetUpload {
  private readonly api = inject(DatasetsApi);
  private readonly destroyRef = inject(DestroyRef);

  /** the study the file is stored in; uploading waits until one is chosen */
  readonly studyId = input<number | null>(null);
  readonly countsChange = output<DatasetCounts | null>();

  protected readonly accept = ACCEPTED_EXTENSIONS.join(',');
  protected readonly state = signal<UploadState>({ step: 'idle' });
  protected readonly problem = signal<string | null>(null);
  protected readonly dragging = signal(false);
  protected readonly counting = signal(false);
  protected readonly counts = signal<CategoryCounts | null>(null);
  private sending: Subscription | null = null;
  private segments: SegmentChoice | null = null;
  /** Segments are offered once raw rows are counted: the dataset's columns and the category column. */
  protected readonly segmentsOffer = computed(() => {
    const state = this.state();
    const selection = this.counts()?.selection;
    return state.step === 'stored' && selection?.shape === 'raw' ? { columns: state.dataset.columnNames, categoryColumn: selection.column } : null;
  });

  constructor() {
    this.destroyRef.onDestroy(() => this.sending?.unsubscribe());
  }

  protected onDragOver(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(true);
  }

  protected onDrop(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    const file = event.dataTransfer?.files?.[0];
    if (file) this.upload(file);
  }

  protected onPicked(input: HTMLInputElement): void {
    const file = input.files?.[0];
    input.value = '';
    if (file) this.upload(file);
  }

  upload(file: File): void {
    const studyId = this.studyId();
    this.problem.set(null);
    this.setCounts(null, null);
    if (studyId === null) {
      this.problem.set('Choose the study the file belongs to first.');
      return;
    }
    const problem = uploadFileProblem(file);
    if (problem) {
      this.problem.set(problem);
      return;
    }
    this.sending?.unsubscribe();
    this.state.set({ step: 'sending', fileName: file.name, fraction: 0 });
    this.sending = this.api.upload(studyId, file).subscribe({
      next: (progress) => {
        if (progress.state === 'sending') {
          this.state.set({ step: 'sending', fileName: file.name, fraction: progress.fraction });
          return;
        }
        this.state.set({ step: 'stored', dataset: progress.dataset });
        this.setCounts(progress.dataset, progress.dataset.selectedCounts);
      },
      error: (error: unknown) => {
        this.state.set({ step: 'idle' });
        this.problem.set(apiErrorMessage(error));
      },
    });
  }

  protected cancelUpload(): void {
    this.sending?.unsubscribe();
    this.sending = null;
    this.state.set({ step: 'idle' });
    this.problem.set('Upload stopped; nothing was stored.');
  }

  protected chooseColumns(dataset: DatasetRecord, selection: CountSelection): void {
    // The upload already counted the columns with few different values: no need to ask again.
    const offered = dataset.offeredCounts.find((counts) => sameSelection(counts.selection, selection));
    this.counting.set(true);
    this.problem.set(null);
    (offered ? of(offered) : this.api.countCategories(dataset.id, selection))
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (counts) => {
          this.counting.set(false);
          this.setCounts(dataset, counts);
        },
        error: (error: unknown) => {
          this.counting.set(false);
          this.setCounts(null, null);
          this.problem.set(apiErrorMessage(error));
        },
      });
  }

  protected startOver(): void {
    this.state.set({ step: 'idle' });
    this.problem.set(null);
    this.setCounts(null, null);
  }

  protected chooseSegments(segments: SegmentChoice | null): void {
    this.segments = segments;
    const state = this.state();
    if (state.step === 'stored') this.setCounts(state.dataset, this.counts());
  }

  private setCounts(dataset: DatasetRecord | null, counts: CategoryCounts | null): void {
    this.counts.set(counts);
    this.countsChange.emit(
      dataset && counts
        ? {
            datasetId: dataset.id,
            datasetName: dataset.fileName,
            selection: counts.selection,
            counts: { labels: counts.labels, counts: counts.counts },
            ...(this.segments && counts.selection.shape === 'raw' ? { segments: this.segments } : {}),
          }
        : null,
    );
  }
}
