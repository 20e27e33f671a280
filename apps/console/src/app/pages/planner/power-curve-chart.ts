import { ChangeDetectionStrategy, Component, computed, ElementRef, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';
import { saveChartAsPng, saveChartAsSvg, type SvgChart } from '../../shared/charts/chart-export';
import { themeColours } from '../../shared/charts/theme-colours';
import type { PowerPoint } from './power-curve';
import { powerCurveOptions } from './power-curve-options';

/** The planner's chart of power against n, with the planned n marked; savable as PNG or SVG. */
@Component({
  selector: 'tf-power-curve-chart',
  imports: [MatButtonModule, MatIconModule, NgxEchartsDirective],
  providers: [provideEchartsCore({ echarts: () => import('../../shared/charts/echarts-parts').then((m) => m.echarts) })],
  template: `
    <div class="save">
      <button mat-button type="button" (click)="savePng()"><mat-icon aria-hidden="true">image</mat-icon> PNG</button>
      <button mat-button type="button" (click)="saveSvg()"><mat-icon aria-hidden="true">draw</mat-icon> SVG</button>
    </div>
    <div
      echarts
      class="canvas"
      data-testid="power-chart"
      [options]="options()"
      [initOpts]="{ renderer: 'svg' }"
      (chartInit)="chart = $any($event)"
      role="img"
      [attr.aria-label]="description()"
    ></div>
    @if (problem(); as message) {
      <p role="alert">{{ message }}</p>
    }
  `,
  styles: `
    :host {
      display: block;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      padding: 12px;
    }
    .save {
      display: flex;
      justify-content: flex-end;
      gap: 4px;
    }
    .canvas {
      width: 100%;
      height: 320px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PowerCurveChart {
  private readonly colours = themeColours(inject<ElementRef<HTMLElement>>(ElementRef).nativeElement);
  readonly points = input.required<PowerPoint[]>();
  /** the planned number of observations, marked on the curve */
  readonly mark = input<number | null>(null);

  protected chart: SvgChart | null = null;
  protected readonly problem = signal<string | null>(null);
  protected readonly options = computed(() => powerCurveOptions(this.points(), this.mark(), this.colours));
  protected readonly description = computed(() => {
    const points = this.points();
    const last = points[points.length - 1];
    return `Power rises from ${points[0].power.toFixed(2)} at ${points[0].n} observations to ${last.power.toFixed(2)} at ${last.n}.`;
  });

  protected saveSvg(): void {
    if (this.chart) saveChartAsSvg(this.chart, 'power-curve');
  }

  protected savePng(): void {
    if (!this.chart) return;
    saveChartAsPng(this.chart, 'power-curve', this.colours.surface).catch((error: Error) => this.problem.set(error.message));
  }
}
