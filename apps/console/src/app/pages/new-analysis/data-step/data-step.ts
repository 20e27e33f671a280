import { BreakpointObserver } from '@angular/cdk/layout';
import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, model, output, signal, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { Study } from '@tallyfit/contracts';
import { map } from 'rxjs';
import { totalOf, type DataChoice, type DataSource } from './data-choice';
import { DatasetUpload, type DatasetCounts } from './dataset-upload';
import { parsePastedCounts, type ParsedCounts } from './pasted-counts';
import { pastedText } from '../prefill';
import { TypedCounts } from './typed-counts';

/** The first step: where the counts come from — an uploaded file, pasted text, or typed rows. */
@Component({
  selector: 'tf-data-step',
  imports: [DecimalPipe, MatButtonToggleModule, MatFormFieldModule, MatInputModule, MatSelectModule, DatasetUpload, TypedCounts],
  templateUrl: './data-step.html',
  styleUrl: './data-step.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DataStep {
  /** studies the person may add to (needed for uploads) */
  readonly studies = input<Study[]>([]);
  readonly studyId = model<number | null>(null);
  readonly dataChange = output<DataChoice | null>();
  /** Counts to start from (change and re-run): shown as pasted text, ready to edit. */
  readonly initial = input<ParsedCounts | null>(null);

  /** On a phone the three sources stack instead of wrapping. */
  protected readonly narrow = toSignal(inject(BreakpointObserver).observe('(max-width: 520px)').pipe(map((state) => state.matches)), {
    initialValue: false,
  });
  protected readonly total = totalOf;
  protected readonly source = signal<DataSource>('type');
  protected readonly pasted = signal('');
  protected readonly pasteOutcome = computed(() => (this.pasted().trim() === '' ? null : parsePastedCounts(this.pasted())));
  private readonly typed = signal<ParsedCounts | null>(null);
  private readonly uploaded = signal<DatasetCounts | null>(null);

  protected readonly choice = computed((): DataChoice | null => {
    switch (this.source()) {
      case 'type': {
        const typed = this.typed();
        return typed ? { source: 'type', observed: typed } : null;
      }
      case 'paste': {
        const outcome = this.pasteOutcome();
        return outcome?.ok ? { source: 'paste', observed: outcome.data } : null;
      }
      case 'upload': {
        const uploaded = this.uploaded();
        return uploaded
          ? {
              source: 'upload',
              observed: uploaded.counts,
              datasetId: uploaded.datasetId,
              datasetName: uploaded.datasetName,
              selection: uploaded.selection,
              ...(uploaded.segments ? { segments: uploaded.segments } : {}),
            }
          : null;
      }
    }
  });

  constructor() {
    effect(() => {
      const initial = this.initial();
      if (!initial) return;
      untracked(() => {
        this.source.set('paste');
        this.pasted.set(pastedText(initial));
      });
    });
    effect(() => this.dataChange.emit(this.choice()));
  }

  protected onTyped(counts: ParsedCounts | null): void {
    this.typed.set(counts);
  }

  protected onUploaded(counts: DatasetCounts | null): void {
    this.uploaded.set(counts);
  }
}
