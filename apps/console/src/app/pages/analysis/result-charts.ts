import { ChangeDetectionStrategy, Component, computed, ElementRef, inject, input, signal } from '@angular/core';
import type { AnalysisResult } from '@tallyfit/engine';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';
import type { SvgChart } from '../../shared/charts/chart-export';
import { ChartSaveButtons } from '../../shared/charts/chart-save-buttons';
import { themeColours } from '../../shared/charts/theme-colours';
import { residualsChartOptions, RESIDUAL_GUIDE, sharesChartOptions } from './chart-options';

const INTERVAL_NAMES: Record<AnalysisResult['intervals']['method'], string> = {
  wilson: 'Wilson',
  goodman: 'Goodman',
  'quesenberry-hurst': 'Quesenberry–Hurst',
  'sison-glaz': 'Sison–Glaz',
};

/** The result's two charts — shares with intervals, and adjusted residuals — each savable as PNG or SVG. */
@Component({
  selector: 'tf-result-charts',
  imports: [ChartSaveButtons, NgxEchartsDirective],
  providers: [provideEchartsCore({ echarts: () => import('../../shared/charts/echarts-parts').then((m) => m.echarts) })],
  templateUrl: './result-charts.html',
  styleUrl: './result-charts.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultCharts {
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  readonly result = input.required<AnalysisResult>();
  /** the start of the saved files' names, e.g. `analysis-12` */
  readonly fileName = input('analysis');

  private readonly colours = themeColours(this.host.nativeElement);
  protected readonly guide = RESIDUAL_GUIDE;
  protected readonly intervalLabel = computed(() => {
    const { method, level } = this.result().intervals;
    return `${Math.round(level * 100)}% ${INTERVAL_NAMES[method]} interval`;
  });
  protected readonly sharesOptions = computed(() => sharesChartOptions(this.result().categories, this.intervalLabel(), this.colours));
  protected readonly residualsOptions = computed(() => residualsChartOptions(this.result().categories, this.colours));
  protected readonly chartHeight = computed(() => Math.max(240, 48 + this.result().categories.length * 36));
  /** the PNG background: the page's surface colour */
  protected readonly background = this.colours.surface;
  /** each chart by name, once ECharts has drawn it */
  protected readonly charts = signal<Partial<Record<'shares' | 'residuals', SvgChart>>>({});

  protected register(name: 'shares' | 'residuals', chart: SvgChart): void {
    this.charts.update((charts) => ({ ...charts, [name]: chart }));
  }
}
