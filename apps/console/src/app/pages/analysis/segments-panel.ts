import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, ElementRef, inject, input, signal } from '@angular/core';
import type { SegmentsResult } from '@tallyfit/engine';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';
import type { SvgChart } from '../../shared/charts/chart-export';
import { ChartSaveButtons } from '../../shared/charts/chart-save-buttons';
import { themeColours } from '../../shared/charts/theme-colours';
import { MAX_PANELS, segmentChartHeight, segmentChartOptions } from './segment-chart-options';

const TEST_NAMES: Record<string, string> = { pearson: 'X²', g: 'G', 'cressie-read': 'CR', exact: 'exact' };

/** The segments of an analysis: the write-up paragraph, the ranked table and the small multiples. */
@Component({
  selector: 'tf-segments-panel',
  imports: [ChartSaveButtons, DecimalPipe, NgxEchartsDirective],
  providers: [provideEchartsCore({ echarts: () => import('../../shared/charts/echarts-parts').then((m) => m.echarts) })],
  templateUrl: './segments-panel.html',
  styleUrl: './segments-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SegmentsPanel {
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  readonly segments = input.required<SegmentsResult>();
  readonly column = input.required<string>();
  readonly fileName = input('analysis');

  private readonly colours = themeColours(this.host.nativeElement);
  protected readonly background = this.colours.surface;
  protected readonly maxPanels = MAX_PANELS;
  protected readonly adjustName = computed(() => (this.segments().adjust === 'holm' ? 'Holm' : 'Benjamini–Hochberg'));
  protected readonly chartOptions = computed(() => segmentChartOptions(this.segments().rows, this.colours));
  protected readonly chartHeight = computed(() => segmentChartHeight(this.segments().rows));
  protected readonly chart = signal<SvgChart | null>(null);

  protected testName(key: string | undefined): string {
    return key ? (TEST_NAMES[key] ?? key) : '—';
  }

  protected drivers(row: SegmentsResult['rows'][number]): string {
    return row.drivers.map((driver) => `${driver.direction} “${driver.label}”`).join(', ');
  }
}
