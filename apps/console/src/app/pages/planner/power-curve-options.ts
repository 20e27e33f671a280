/** ECharts options for power against n: a line with point markers, a dashed 0.8 guide and the planned n marked in words. */
import type { ChartColours } from '../../shared/charts/theme-colours';
import type { PowerPoint } from './power-curve';

export function powerCurveOptions(points: readonly PowerPoint[], mark: number | null, colours: ChartColours): Record<string, unknown> {
  return {
    aria: { enabled: true },
    backgroundColor: colours.surface,
    textStyle: { fontFamily: 'Roboto, system-ui, sans-serif', color: colours.text },
    animation: false,
    grid: { left: 8, right: 24, top: 24, bottom: 32, containLabel: true },
    tooltip: { trigger: 'axis', valueFormatter: (value: number) => value.toFixed(3) },
    xAxis: {
      type: 'value',
      name: 'Observations',
      nameLocation: 'middle',
      nameGap: 28,
      min: 0,
      axisLabel: { color: colours.text },
      splitLine: { lineStyle: { color: colours.grid } },
    },
    yAxis: {
      type: 'value',
      name: 'Power',
      min: 0,
      max: 1,
      axisLabel: { color: colours.text },
      splitLine: { lineStyle: { color: colours.grid } },
    },
    series: [
      {
        name: 'Power',
        type: 'line',
        showSymbol: false,
        data: points.map((point) => [point.n, point.power]),
        lineStyle: { color: colours.primary, width: 3 },
        itemStyle: { color: colours.primary },
        markLine: {
          symbol: 'none',
          silent: true,
          lineStyle: { color: colours.text, type: 'dashed' },
          data: [
            { yAxis: 0.8, label: { formatter: 'power 0.8', position: 'insideEndTop', color: colours.text } },
            ...(mark !== null ? [{ xAxis: mark, label: { formatter: `n = ${mark}`, position: 'end', color: colours.text } }] : []),
          ],
        },
      },
    ],
  };
}
