import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatSortModule, type Sort, type SortDirection } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import type { AnalysisSummary } from '@tallyfit/contracts';
import { formatP } from '../../core/format/p-value';
import { AnalysisStatusChip } from '../analysis-status/analysis-status-chip';
import { testWords } from '../analysis-status/analysis-status-words';

/** What the row's action button offers. */
export type RowAction = 'review' | 'discuss';

/**
 * A table of analyses: title, study, author, tests, review state, p and decision, date. Sorting is
 * the caller's job (the history sorts on the server): the table only reports the chosen column.
 * Column ids of sortable columns are the API's sort keys.
 */
@Component({
  selector: 'tf-analyses-table',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatSortModule, MatTableModule, AnalysisStatusChip],
  templateUrl: './analyses-table.html',
  styleUrl: './analyses-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AnalysesTable {
  readonly analyses = input.required<AnalysisSummary[]>();
  readonly label = input('Analyses');
  readonly showStudy = input(true);
  readonly sortable = input(false);
  readonly sortActive = input('date');
  readonly sortDirection = input<SortDirection>('desc');
  /** How each row's action button reads, or null for no action column. */
  readonly rowAction = input<((analysis: AnalysisSummary) => RowAction) | null>(null);

  readonly sortChange = output<Sort>();
  readonly opened = output<AnalysisSummary>();

  protected readonly formatP = formatP;
  protected readonly testWords = testWords;
  protected readonly columns = computed(() => [
    'title',
    ...(this.showStudy() ? ['study'] : []),
    'author',
    'tests',
    'status',
    'p',
    'date',
    ...(this.rowAction() ? ['actions'] : []),
  ]);

  protected actionFor(analysis: AnalysisSummary): RowAction | null {
    return this.rowAction()?.(analysis) ?? null;
  }
}
