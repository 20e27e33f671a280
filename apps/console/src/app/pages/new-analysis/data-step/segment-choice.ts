import { ChangeDetectionStrategy, Component, computed, effect, input, output, signal } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import type { SegmentAdjustMethod } from '@tallyfit/engine';

/** An optional second column to split the counts by, and how the family of segment p-values is adjusted. */
export interface SegmentChoice {
  column: string;
  adjust: SegmentAdjustMethod;
}

/**
 * The optional segments step: pick a second column (a browser, a country, a line) and each of its
 * values is tested on its own against the same hypothesis, the p-values adjusted as a family.
 */
@Component({
  selector: 'tf-segment-choice',
  imports: [MatButtonToggleModule, MatFormFieldModule, MatSelectModule],
  templateUrl: './segment-choice.html',
  styleUrl: './segment-choice.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SegmentChoicePicker {
  /** the dataset's columns */
  readonly columns = input.required<string[]>();
  /** the column that holds the categories (it cannot also split them) */
  readonly categoryColumn = input.required<string>();
  readonly segmentsChange = output<SegmentChoice | null>();

  protected readonly column = signal('');
  protected readonly adjust = signal<SegmentAdjustMethod>('holm');
  protected readonly candidates = computed(() => this.columns().filter((name) => name !== this.categoryColumn()));

  constructor() {
    effect(() => {
      // A column that is now the category column cannot split it.
      if (this.column() === this.categoryColumn()) this.column.set('');
    });
    effect(() => this.segmentsChange.emit(this.column() ? { column: this.column(), adjust: this.adjust() } : null));
  }
}
