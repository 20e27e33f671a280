/**
 * The watch's two timeline charts as ECharts options (plain objects, so they can be tested without a
 * browser): one category's cumulative share with its confidence-sequence band against the expected
 * share, and the sequential p after each batch on a log scale with the alpha line. Both read
 * without colour: the band is shaded, the expected share is dashed, the alpha line is labelled.
 */
import type { WatchBatch } from '@tallyfit/contracts';
import type { ChartColours } from '../../shared/charts/theme-colours';

const percent = (value: number): string => `${(value * 100).toFixed(1)}%`;

/** The smallest p the chart can draw: a log axis cannot reach 0, and the engine reports p = 0 only on underflow. */
const SMALLEST_DRAWN_P = 1e-300;

/** The shares chart of one category, batches oldest first. */
export function sharesTimelineOptions(batches: readonly WatchBatch[], label: string, colours: ChartColours): Record<string, unknown> {
  const rows = batches.map((batch) => {
    const share = batch.shares.find((candidate) => candidate.label === label);
    return { sequence: batch.sequence, share };
  });
  const values = rows.flatMap(({ share }) => (share ? [share.lower, share.upper, share.expected] : []));
  const [low, high] = paddedRange(values);
  return {
    aria: { enabled: true },
    backgroundColor: colours.surface,
    textStyle: { fontFamily: 'Roboto, system-ui, sans-serif', color: colours.text },
    animation: false,
    legend: { top: 0, data: ['Share so far', 'Confidence band', 'Expected share'], textStyle: { color: colours.text } },
    grid: { left: 8, right: 16, top: 48, bottom: 36, containLabel: true },
    tooltip: {
      trigger: 'axis',
      formatter: (items: { dataIndex: number }[]) => {
        const row = rows[items[0]?.dataIndex ?? 0];
        if (!row?.share) return '';
        const { estimate, lower, upper, expected } = row.share;
        return `After batch ${row.sequence}<br>Share so far ${percent(estimate)}<br>Band ${percent(lower)} to ${percent(upper)}<br>Expected ${percent(expected)}`;
      },
    },
    xAxis: {
      type: 'category',
      data: rows.map((row) => String(row.sequence)),
      name: 'Batch',
      nameLocation: 'middle',
      nameGap: 24,
      axisLabel: { color: colours.text },
    },
    yAxis: {
      type: 'value',
      min: low,
      max: high,
      axisLabel: { color: colours.text, formatter: (value: number) => percent(value) },
      splitLine: { lineStyle: { color: colours.grid } },
    },
    series: [
      // The band is drawn as two stacked lines: an invisible one at the lower bound, and the band's
      // width stacked on it and shaded.
      {
        name: 'band-floor',
        type: 'line',
        stack: 'band',
        data: rows.map(({ share }) => share?.lower ?? null),
        lineStyle: { opacity: 0 },
        symbol: 'none',
        silent: true,
        tooltip: { show: false },
      },
      {
        name: 'Confidence band',
        type: 'line',
        stack: 'band',
        data: rows.map(({ share }) => (share ? share.upper - share.lower : null)),
        lineStyle: { opacity: 0 },
        areaStyle: { color: colours.primary, opacity: 0.22 },
        itemStyle: { color: colours.primary, opacity: 0.22 },
        symbol: 'none',
        silent: true,
      },
      {
        name: 'Share so far',
        type: 'line',
        data: rows.map(({ share }) => share?.estimate ?? null),
        itemStyle: { color: colours.primary },
        lineStyle: { width: 2 },
        symbol: 'circle',
        symbolSize: 5,
      },
      {
        name: 'Expected share',
        type: 'line',
        data: rows.map(({ share }) => share?.expected ?? null),
        itemStyle: { color: colours.tertiary },
        lineStyle: { type: 'dashed', width: 2 },
        symbol: 'none',
      },
    ],
  };
}

/** The sequential p after each batch (log scale), each batch's own p for comparison, and the alpha line. */
export function sequentialPTimelineOptions(batches: readonly WatchBatch[], alpha: number, colours: ChartColours): Record<string, unknown> {
  const drawn = (p: number) => Math.max(p, SMALLEST_DRAWN_P);
  const smallest = Math.min(alpha / 10, ...batches.map((batch) => batch.sequentialP), ...batches.flatMap((batch) => (batch.batchP === null ? [] : [batch.batchP])));
  return {
    aria: { enabled: true },
    backgroundColor: colours.surface,
    textStyle: { fontFamily: 'Roboto, system-ui, sans-serif', color: colours.text },
    animation: false,
    legend: { top: 0, data: ['Sequential p', 'Batch on its own'], textStyle: { color: colours.text } },
    grid: { left: 8, right: 24, top: 48, bottom: 36, containLabel: true },
    tooltip: { trigger: 'axis', valueFormatter: (value: number) => pLabel(value) },
    xAxis: {
      type: 'category',
      data: batches.map((batch) => String(batch.sequence)),
      name: 'Batch',
      nameLocation: 'middle',
      nameGap: 24,
      axisLabel: { color: colours.text },
    },
    yAxis: {
      type: 'log',
      logBase: 10,
      min: logFloor(drawn(smallest)),
      max: 1,
      axisLabel: { color: colours.text, formatter: (value: number) => pLabel(value) },
      splitLine: { lineStyle: { color: colours.grid } },
    },
    series: [
      {
        name: 'Sequential p',
        type: 'line',
        step: 'end',
        data: batches.map((batch) => drawn(batch.sequentialP)),
        itemStyle: { color: colours.primary },
        lineStyle: { width: 2 },
        symbol: 'circle',
        symbolSize: 5,
        markLine: {
          symbol: 'none',
          silent: true,
          lineStyle: { color: colours.text, type: 'dashed' },
          label: { position: 'insideEndTop', color: colours.text, formatter: `alpha = ${alpha}` },
          data: [{ yAxis: alpha }],
        },
      },
      {
        name: 'Batch on its own',
        type: 'scatter',
        symbol: 'triangle',
        symbolSize: 7,
        data: batches.map((batch) => (batch.batchP === null ? null : drawn(batch.batchP))),
        itemStyle: { color: colours.tertiary, borderColor: colours.text, borderWidth: 0.5 },
      },
    ],
  };
}

/** A p on the axis: plain decimals down to 0.0001, powers of ten below. */
export function pLabel(value: number): string {
  if (value >= 1e-4) return String(Number(value.toPrecision(3)));
  return `1e${Math.round(Math.log10(value))}`;
}

/** The power of ten at or below a value, so the log axis starts on a round number. */
export function logFloor(value: number): number {
  return 10 ** Math.floor(Math.log10(value));
}

/** The share axis's range: the values' range with a margin, kept within 0 and 1, on steps of 1%. */
export function paddedRange(values: readonly number[]): [number, number] {
  if (values.length === 0) return [0, 1];
  const low = Math.min(...values);
  const high = Math.max(...values);
  const margin = Math.max((high - low) * 0.1, 0.01);
  // Rounded to 9 places first, so 0.55 + 0.01 is taken as 56% rather than lifted to 57% by binary rounding.
  const hundredths = (value: number) => Number((value * 100).toFixed(9));
  return [Math.max(0, Math.floor(hundredths(low - margin)) / 100), Math.min(1, Math.ceil(hundredths(high + margin)) / 100)];
}
