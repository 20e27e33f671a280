import { ChangeDetectionStrategy, Component, computed, effect, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import type { CountSelection, DatasetRecord } from '@tallyfit/contracts';
import { guessColumnChoice } from './column-guess';

type Shape = CountSelection['shape'];

/** A preview of the dataset's first rows and the choice of which columns hold the categories (and counts). */
@Component({
  selector: 'tf-column-picker',
  imports: [FormsModule, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatSelectModule],
  templateUrl: './column-picker.html',
  styleUrl: './column-picker.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ColumnPicker {
  readonly dataset = input.required<DatasetRecord>();
  readonly busy = input(false);
  readonly choose = output<CountSelection>();

  protected readonly layout = signal<Shape>('raw');
  protected readonly column = signal('');
  protected readonly labelColumn = signal('');
  protected readonly countColumn = signal('');

  protected readonly choice = computed((): CountSelection | null => {
    if (this.layout() === 'raw') return this.column() ? { shape: 'raw', column: this.column() } : null;
    const labelColumn = this.labelColumn();
    const countColumn = this.countColumn();
    return labelColumn && countColumn && labelColumn !== countColumn ? { shape: 'counts', labelColumn, countColumn } : null;
  });
  protected readonly sameColumns = computed(
    () => this.layout() === 'counts' && this.labelColumn() !== '' && this.labelColumn() === this.countColumn(),
  );

  constructor() {
    // Start from the dataset's stored choice, or a guess from its first rows.
    effect(() => {
      const dataset = this.dataset();
      const start = dataset.selectedCounts?.selection ?? guessColumnChoice(dataset.columnNames, dataset.preview);
      if (!start) return;
      this.layout.set(start.shape);
      if (start.shape === 'raw') {
        this.column.set(start.column);
        this.labelColumn.set(dataset.columnNames[0] ?? '');
        this.countColumn.set(dataset.columnNames[1] ?? '');
      } else {
        this.column.set(start.labelColumn);
        this.labelColumn.set(start.labelColumn);
        this.countColumn.set(start.countColumn);
      }
    });
  }

  protected submit(): void {
    const choice = this.choice();
    if (choice) this.choose.emit(choice);
  }
}
