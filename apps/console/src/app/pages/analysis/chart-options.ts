/**
 * The two charts of a result as ECharts options (plain objects, so they can be tested without a
 * browser). Both are readable without colour: observed shares are hatched bars, expected shares
 * are diamond markers, intervals are whiskers, every bar carries its value as a label, and the
 * residual chart marks the ±1.96 lines with words.
 */
import type { CategoryRow } from '@tallyfit/engine';
import type { ChartColours } from '../../shared/charts/theme-colours';

/** Adjusted residuals beyond this are unusual at the 5% level for one category (two-sided normal quantile). */
export const RESIDUAL_GUIDE = 1.96;


/** Bars shorter than this share leave no room for a label inside. */
const SHORT_BAR = 0.06;

const percent = (value: number): string => `${(value * 100).toFixed(1)}%`;

/** Observed share per category (bars) with its interval (whiskers), and the expected share (diamonds). */
export function sharesChartOptions(rows: readonly CategoryRow[], intervalLabel: string, colours: ChartColours): Record<string, unknown> {
  const labels = rows.map((row) => row.label);
  return {
    aria: { enabled: true, decal: { show: true } },
    backgroundColor: colours.surface,
    textStyle: { fontFamily: 'Roboto, system-ui, sans-serif', color: colours.text },
    animation: false,
    legend: { top: 0, textStyle: { color: colours.text } },
    grid: { left: 8, right: 16, top: 56, bottom: 8, containLabel: true },
    tooltip: { trigger: 'axis', valueFormatter: (value: number) => percent(value) },
    xAxis: { type: 'category', data: labels, axisLabel: { color: colours.text, interval: 0, rotate: labels.length > 6 ? 30 : 0 } },
    yAxis: {
      type: 'value',
      axisLabel: { color: colours.text, formatter: (value: number) => `${Math.round(value * 100)}%` },
      splitLine: { lineStyle: { color: colours.grid } },
    },
    series: [
      {
        name: 'Observed share',
        type: 'bar',
        data: rows.map((row) => row.share),
        itemStyle: { color: colours.primary, decal: { symbol: 'rect', dashArrayX: [1, 0], dashArrayY: [3, 5], rotation: -Math.PI / 4 } },
        // Short bars cannot hold their label; their value is in the table and the tooltip.
        label: {
          show: true,
          position: 'insideBottom',
          color: '#fff',
          formatter: (item: { value: number }) => (item.value >= SHORT_BAR ? percent(item.value) : ''),
        },
        barMaxWidth: 56,
      },
      {
        name: intervalLabel,
        type: 'custom',
        data: rows.map((row, index) => [index, row.interval.low, row.interval.high]),
        renderItem: intervalWhisker(colours.text),
        encode: { x: 0, y: [1, 2] },
        z: 10,
      },
      {
        name: 'Expected share',
        type: 'scatter',
        symbol: 'diamond',
        symbolSize: 16,
        data: rows.map((row) => row.expectedShare),
        itemStyle: { color: colours.tertiary, borderColor: colours.text, borderWidth: 1 },
        z: 11,
      },
    ],
  };
}

/** A whisker from the interval's low to its high end, with caps, drawn by ECharts' custom series. */
function intervalWhisker(colour: string) {
  return (
    _params: unknown,
    api: { value(dimension: number): number; coord(point: number[]): number[]; size(value: number[]): number[] },
  ): Record<string, unknown> => {
    const x = api.value(0);
    const low = api.coord([x, api.value(1)]);
    const high = api.coord([x, api.value(2)]);
    const cap = Math.max(4, api.size([1, 0])[0] * 0.12);
    const style = { stroke: colour, lineWidth: 2 };
    return {
      type: 'group',
      children: [
        { type: 'line', shape: { x1: low[0], y1: low[1], x2: high[0], y2: high[1] }, style },
        { type: 'line', shape: { x1: low[0] - cap, y1: low[1], x2: low[0] + cap, y2: low[1] }, style },
        { type: 'line', shape: { x1: high[0] - cap, y1: high[1], x2: high[0] + cap, y2: high[1] }, style },
      ],
    };
  };
}

/** Adjusted residual per category as horizontal bars, with the ±1.96 guide lines labelled. */
export function residualsChartOptions(rows: readonly CategoryRow[], colours: ChartColours): Record<string, unknown> {
  const extreme = Math.max(RESIDUAL_GUIDE + 0.5, ...rows.map((row) => Math.abs(row.adjustedResidual)));
  const limit = Math.ceil(extreme);
  return {
    aria: { enabled: true, decal: { show: true } },
    backgroundColor: colours.surface,
    textStyle: { fontFamily: 'Roboto, system-ui, sans-serif', color: colours.text },
    animation: false,
    grid: { left: 8, right: 48, top: 32, bottom: 36, containLabel: true },
    tooltip: { trigger: 'axis', valueFormatter: (value: number) => value.toFixed(2) },
    xAxis: {
      type: 'value',
      min: -limit,
      max: limit,
      name: 'Adjusted residual',
      nameLocation: 'middle',
      nameGap: 24,
      nameTextStyle: { color: colours.text },
      axisLabel: { color: colours.text },
      splitLine: { lineStyle: { color: colours.grid } },
    },
    yAxis: {
      type: 'category',
      data: rows.map((row) => row.label),
      inverse: true,
      axisLabel: { color: colours.text },
    },
    series: [
      {
        name: 'Adjusted residual',
        type: 'bar',
        data: rows.map((row) => ({
          value: row.adjustedResidual,
          // Above expectation hatched one way, below the other: the direction reads without colour.
          itemStyle: {
            color: row.adjustedResidual >= 0 ? colours.primary : colours.tertiary,
            decal: { symbol: 'rect', dashArrayX: [1, 0], dashArrayY: [2, 4], rotation: row.adjustedResidual >= 0 ? Math.PI / 4 : -Math.PI / 4 },
          },
        })),
        label: { show: true, position: 'right', color: colours.text, formatter: (item: { value: number }) => signed(item.value) },
        barMaxWidth: 28,
        markLine: {
          symbol: 'none',
          silent: true,
          lineStyle: { color: colours.text, type: 'dashed' },
          // Labels at the top end of the guide lines (the category axis is inverted), clear of the axis labels below.
          label: { position: 'start', color: colours.text, formatter: (item: { value: number }) => signed(item.value) },
          data: [{ xAxis: -RESIDUAL_GUIDE }, { xAxis: RESIDUAL_GUIDE }],
        },
      },
    ],
  };
}

function signed(value: number): string {
  return `${value > 0 ? '+' : value < 0 ? '−' : ''}${Math.abs(value).toFixed(2)}`;
}
