import { ChangeDetectionStrategy, Component, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { saveChartAsPng, saveChartAsSvg, type SvgChart } from './chart-export';

/** The pair of buttons that save one chart as a PNG picture or an SVG drawing, and say when that fails. */
@Component({
  selector: 'tf-chart-save-buttons',
  imports: [MatButtonModule, MatIconModule],
  template: `
    <button mat-button type="button" (click)="savePng()"><mat-icon aria-hidden="true">image</mat-icon> PNG</button>
    <button mat-button type="button" (click)="saveSvg()"><mat-icon aria-hidden="true">draw</mat-icon> SVG</button>
    @if (problem(); as message) {
      <p class="problem" role="alert">{{ message }}</p>
    }
  `,
  styles: `
    :host {
      display: inline-flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 4px;
    }
    .problem {
      color: var(--mat-sys-error);
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChartSaveButtons {
  /** the drawn chart, once ECharts has started it */
  readonly chart = input.required<SvgChart | null>();
  /** the saved file's name without its extension */
  readonly fileName = input.required<string>();
  /** the colour behind a PNG picture (SVG stays transparent) */
  readonly background = input.required<string>();

  protected readonly problem = signal<string | null>(null);

  protected saveSvg(): void {
    const chart = this.chart();
    if (chart) saveChartAsSvg(chart, this.fileName());
  }

  protected savePng(): void {
    const chart = this.chart();
    if (!chart) return;
    this.problem.set(null);
    saveChartAsPng(chart, this.fileName(), this.background()).catch((error: Error) => this.problem.set(error.message));
  }
}
