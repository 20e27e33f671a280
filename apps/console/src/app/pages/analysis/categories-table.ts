import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { standsOut, type AnalysisResult } from '@tallyfit/engine';
import { formatP } from '../../core/format/p-value';

/** Each category's observed and expected counts, share, residuals, adjusted p and interval, marked where it stands out. */
@Component({
  selector: 'tf-categories-table',
  imports: [DecimalPipe],
  templateUrl: './categories-table.html',
  styleUrl: './categories-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CategoriesTable {
  readonly result = input.required<AnalysisResult>();
  /** the engine's rule, the same one its write-up uses for the categories that drive a difference */
  protected readonly standsOut = standsOut;
  protected readonly formatP = formatP;

  protected adjustWord(adjust: AnalysisResult['posthoc']['adjust']): string {
    return { holm: 'Holm-adjusted', bonferroni: 'Bonferroni-adjusted', none: 'unadjusted' }[adjust];
  }
}
