import { ChangeDetectionStrategy, Component, computed, ElementRef, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { AnalysisResult } from '@tallyfit/engine';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';
import { saveChartAsPng, saveChartAsSvg, type SvgChart } from '../../shared/charts/chart-export';
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
  imports: [MatButtonModule, MatIconModule, NgxEchartsDirective],
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
  protected readonly problem = signal<string | null>(null);

  private readonly charts = new Map<string, SvgChart>();

  protected register(name: string, chart: unknown): void {
    this.charts.set(name, chart as SvgChart);
  }

  protected saveSvg(name: string): void {
    const chart = this.charts.get(name);
    if (chart) saveChartAsSvg(chart, `${this.fileName()}-${name}`);
  }

  protected savePng(name: string): void {
    const chart = this.charts.get(name);
    if (!chart) return;
    this.problem.set(null);
    saveChartAsPng(chart, `${this.fileName()}-${name}`, this.colours.surface).catch((error: Error) => this.problem.set(error.message));
  }
}
