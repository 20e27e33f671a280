/**
 * The segments' small multiples as one set of ECharts options (a plain object, testable without a
 * browser): one small panel per segment, in rank order, each with the observed share of every
 * category (hatched bars) against the expected share (diamonds), on the same scale so panels compare.
 */
import type { SegmentRow } from '@tallyfit/engine';
import type { ChartColours } from '../../shared/charts/theme-colours';

/** At most this many panels; the table lists every segment. */
export const MAX_PANELS = 12;
const COLUMNS = 3;
export const PANEL_HEIGHT = 170;
const TITLE_SPACE = 28;

const percent = (value: number): string => `${(value * 100).toFixed(1)}%`;

/** The segments drawn: tested ones, smallest p first, at most MAX_PANELS. */
export function panelRows(rows: readonly SegmentRow[]): SegmentRow[] {
  return rows.filter((row) => row.rank !== undefined && row.categories.length > 0).slice(0, MAX_PANELS);
}

export function segmentChartHeight(rows: readonly SegmentRow[]): number {
  return Math.ceil(panelRows(rows).length / COLUMNS) * (PANEL_HEIGHT + TITLE_SPACE) + 40;
}

export function segmentChartOptions(rows: readonly SegmentRow[], colours: ChartColours): Record<string, unknown> {
  const panels = panelRows(rows);
  const columns = Math.min(COLUMNS, Math.max(1, panels.length));
  const width = 100 / columns;
  const shares = panels.map((row) => row.categories.map((category) => ({ observed: category.observed / row.n, expected: category.expected / row.n })));
  const top = Math.max(0.05, ...shares.flat().flatMap((share) => [share.observed, share.expected]));
  const place = (index: number) => ({ left: `${(index % columns) * width + 2}%`, width: `${width - 4}%`, top: 40 + Math.floor(index / columns) * (PANEL_HEIGHT + TITLE_SPACE) + TITLE_SPACE });
  return {
    aria: { enabled: true, decal: { show: true } },
    backgroundColor: colours.surface,
    textStyle: { fontFamily: 'Roboto, system-ui, sans-serif', color: colours.text },
    animation: false,
    legend: { top: 0, data: ['Observed share', 'Expected share'], textStyle: { color: colours.text } },
    tooltip: { trigger: 'axis', valueFormatter: (value: number) => percent(value) },
    title: panels.map((row, i) => ({
      text: `${row.rank}. ${row.segment}${row.significant ? ' — departs' : ''}`,
      subtext: `N = ${row.n.toLocaleString('en-US')}`,
      left: place(i).left,
      top: place(i).top - TITLE_SPACE,
      textStyle: { fontSize: 12, fontWeight: row.significant ? 'bold' : 'normal', color: colours.text },
      subtextStyle: { fontSize: 10, color: colours.text },
      itemGap: 2,
    })),
    grid: panels.map((_, i) => ({ ...place(i), height: PANEL_HEIGHT - 40, containLabel: true })),
    xAxis: panels.map((row, i) => ({
      type: 'category',
      gridIndex: i,
      data: row.categories.map((category) => category.label),
      axisLabel: { color: colours.text, fontSize: 10, interval: 0, rotate: row.categories.length > 4 ? 30 : 0 },
    })),
    yAxis: panels.map((_, i) => ({
      type: 'value',
      gridIndex: i,
      max: Math.min(1, Math.ceil(top * 20) / 20),
      axisLabel: { color: colours.text, fontSize: 10, formatter: (value: number) => `${Math.round(value * 100)}%` },
      splitLine: { lineStyle: { color: colours.grid } },
    })),
    series: panels.flatMap((_, i) => [
      {
        name: 'Observed share',
        type: 'bar',
        xAxisIndex: i,
        yAxisIndex: i,
        data: shares[i].map((share) => share.observed),
        itemStyle: { color: colours.primary, decal: { symbol: 'rect', dashArrayX: [1, 0], dashArrayY: [3, 5], rotation: -Math.PI / 4 } },
        barMaxWidth: 28,
      },
      {
        name: 'Expected share',
        type: 'scatter',
        xAxisIndex: i,
        yAxisIndex: i,
        data: shares[i].map((share) => share.expected),
        symbol: 'diamond',
        symbolSize: 11,
        itemStyle: { color: colours.tertiary, borderColor: colours.surface, borderWidth: 1 },
        z: 10,
      },
    ]),
  };
}
