import { ChangeDetectionStrategy, Component, computed, ElementRef, inject, input, linkedSignal, signal } from '@angular/core';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import type { WatchBatch } from '@tallyfit/contracts';
import { NgxEchartsDirective, provideEchartsCore } from 'ngx-echarts';
import type { SvgChart } from '../../shared/charts/chart-export';
import { ChartSaveButtons } from '../../shared/charts/chart-save-buttons';
import { themeColours } from '../../shared/charts/theme-colours';
import { sequentialPTimelineOptions, sharesTimelineOptions } from './timeline-options';
import { furthestCategory } from './watch-view';

/** The watch over time: one category's share with its band against the expected share, and the sequential p. */
@Component({
  selector: 'tf-watch-timeline',
  imports: [ChartSaveButtons, MatButtonToggleModule, NgxEchartsDirective],
  providers: [provideEchartsCore({ echarts: () => import('../../shared/charts/echarts-parts').then((m) => m.echarts) })],
  templateUrl: './watch-timeline.html',
  styleUrl: './watch-timeline.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WatchTimeline {
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  /** oldest first */
  readonly batches = input.required<WatchBatch[]>();
  readonly labels = input.required<string[]>();
  readonly alpha = input.required<number>();
  /** the start of the saved files' names, e.g. `watch-3` */
  readonly fileName = input('watch');

  private readonly colours = themeColours(this.host.nativeElement);
  /** The category shown: at first the one furthest from its expected share, then the person's choice. */
  protected readonly label = linkedSignal(() => furthestCategory(this.batches().at(-1)?.shares ?? []) ?? this.labels()[0]);
  protected readonly sharesOptions = computed(() => sharesTimelineOptions(this.batches(), this.label(), this.colours));
  protected readonly pOptions = computed(() => sequentialPTimelineOptions(this.batches(), this.alpha(), this.colours));
  protected readonly background = this.colours.surface;
  protected readonly charts = signal<Partial<Record<'shares' | 'p', SvgChart>>>({});

  protected register(name: 'shares' | 'p', chart: SvgChart): void {
    this.charts.update((charts) => ({ ...charts, [name]: chart }));
  }
}
