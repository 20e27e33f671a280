import { ChangeDetectionStrategy, Component, computed, ElementRef, inject, input, signal } from '@angular/core';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';
import type { SvgChart } from '../../shared/charts/chart-export';
import { ChartSaveButtons } from '../../shared/charts/chart-save-buttons';
import { themeColours } from '../../shared/charts/theme-colours';
import type { PowerPoint } from './power-curve';
import { powerCurveOptions } from './power-curve-options';

/** The planner's chart of power against n, with the planned n marked; savable as PNG or SVG. */
@Component({
  selector: 'tf-power-curve-chart',
  imports: [ChartSaveButtons, NgxEchartsDirective],
  providers: [provideEchartsCore({ echarts: () => import('../../shared/charts/echarts-parts').then((m) => m.echarts) })],
  template: `
    <div class="save">
      <tf-chart-save-buttons [chart]="chart()" fileName="power-curve" [background]="colours.surface" />
    </div>
    <div
      echarts
      class="canvas"
      data-testid="power-chart"
      [options]="options()"
      [initOpts]="{ renderer: 'svg' }"
      (chartInit)="chart.set($any($event))"
      role="img"
      [attr.aria-label]="description()"
    ></div>
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
  protected readonly colours = themeColours(inject<ElementRef<HTMLElement>>(ElementRef).nativeElement);
  readonly points = input.required<PowerPoint[]>();
  /** the planned number of observations, marked on the curve */
  readonly mark = input<number | null>(null);

  protected readonly chart = signal<SvgChart | null>(null);
  protected readonly options = computed(() => powerCurveOptions(this.points(), this.mark(), this.colours));
  protected readonly description = computed(() => {
    const points = this.points();
    const last = points[points.length - 1];
    return `Power rises from ${points[0].power.toFixed(2)} at ${points[0].n} observations to ${last.power.toFixed(2)} at ${last.n}.`;
  });
}
