import { analyze } from '@tallyfit/engine';
import type { ChartColours } from '../../shared/charts/theme-colours';
import { residualsChartOptions, RESIDUAL_GUIDE, sharesChartOptions } from './chart-options';

const colours: ChartColours = { primary: '#123', tertiary: '#456', text: '#000', grid: '#ccc', surface: '#fff' };
const result = analyze({ observed: { labels: ['a', 'b', 'c'], counts: [30, 50, 20] }, hypothesis: { kind: 'equal' } });

type Series = { name: string; type: string; data: unknown[]; markLine?: { data: { xAxis: number }[] } };

describe('sharesChartOptions', () => {
  const options = sharesChartOptions(result.categories, '95% Wilson interval', colours) as { series: Series[]; aria: unknown };

  it('draws observed shares as bars, intervals as whiskers and expected shares as diamonds', () => {
    expect(options.series.map((series) => [series.name, series.type])).toEqual([
      ['Observed share', 'bar'],
      ['95% Wilson interval', 'custom'],
      ['Expected share', 'scatter'],
    ]);
    expect(options.series[0].data).toEqual([0.3, 0.5, 0.2]);
    expect(options.series[2].data).toEqual(result.categories.map((row) => row.expectedShare));
    expect(options.series[1].data[1]).toEqual([1, result.categories[1].interval.low, result.categories[1].interval.high]);
  });

  it('turns on patterns so the chart reads without colour', () => {
    expect(options.aria).toEqual({ enabled: true, decal: { show: true } });
  });
});

describe('residualsChartOptions', () => {
  const options = residualsChartOptions(result.categories, colours) as { series: Series[]; xAxis: { min: number; max: number } };

  it('plots each category’s adjusted residual with guide lines at ±1.96', () => {
    const bars = options.series[0];
    expect((bars.data as { value: number }[]).map((item) => item.value)).toEqual(result.categories.map((row) => row.adjustedResidual));
    expect(bars.markLine?.data).toEqual([{ xAxis: -RESIDUAL_GUIDE }, { xAxis: RESIDUAL_GUIDE }]);
  });

  it('keeps the axis symmetric and wide enough for the largest residual', () => {
    const largest = Math.max(...result.categories.map((row) => Math.abs(row.adjustedResidual)));
    expect(options.xAxis.max).toBe(-options.xAxis.min);
    expect(options.xAxis.max).toBeGreaterThanOrEqual(largest);
  });
});
