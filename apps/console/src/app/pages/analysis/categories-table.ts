import { LowerCasePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { categoryCells, categoryHeadings, standsOut, type AnalysisResult } from '@tallyfit/engine';

/**
 * Each category as one row: what was counted against what was expected (count and share), how far
 * apart they are in standard errors (marked where the category stands out), its p and the range for
 * its share. The numbers are the engine's shared cells, so the reports print the same digits.
 */
@Component({
  selector: 'tf-categories-table',
  imports: [LowerCasePipe],
  templateUrl: './categories-table.html',
  styleUrl: './categories-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CategoriesTable {
  readonly result = input.required<AnalysisResult>();

  protected readonly headings = computed(() => categoryHeadings(this.result()));
  protected readonly rows = computed(() => {
    const result = this.result();
    const cells = categoryCells(result);
    // The gap bar's scale: the largest gap fills the cell, so the bars compare categories at a glance.
    const widest = Math.max(...result.categories.map((row) => Math.abs(row.adjustedResidual)), 1e-9);
    return result.categories.map((row, index) => ({
      cells: cells[index],
      smallExpected: row.expected < 5,
      // the engine's rule, the same one its write-up uses for the categories that drive a difference
      departure: standsOut(row, result.conclusion.alpha),
      barPercent: (Math.abs(row.adjustedResidual) / widest) * 50,
      barAbove: row.adjustedResidual >= 0,
    }));
  });
  protected readonly adjustWord = computed(
    () => ({ holm: 'Holm-adjusted', bonferroni: 'Bonferroni-adjusted', none: 'unadjusted' })[this.result().posthoc.adjust],
  );
  protected readonly rangeHeading = computed(() => this.headings().intervalLow.replace(/, low$/, ' of the share'));
}
