import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { AnalysisResult } from '@tallyfit/engine';
import { formatP } from '../../core/format/p-value';
import { RESIDUAL_GUIDE } from './chart-options';

/** Each category's observed and expected counts, share, residuals, adjusted p and interval. */
@Component({
  selector: 'tf-categories-table',
  imports: [DecimalPipe],
  templateUrl: './categories-table.html',
  styleUrl: './categories-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CategoriesTable {
  readonly result = input.required<AnalysisResult>();
  protected readonly guide = RESIDUAL_GUIDE;
  protected readonly formatP = formatP;

  protected adjustWord(adjust: AnalysisResult['posthoc']['adjust']): string {
    return { holm: 'Holm-adjusted', bonferroni: 'Bonferroni-adjusted', none: 'unadjusted' }[adjust];
  }
}
