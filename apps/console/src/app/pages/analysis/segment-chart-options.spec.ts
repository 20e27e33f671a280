import type { SegmentRow } from '@tallyfit/engine';
import { MAX_PANELS, panelRows, segmentChartOptions } from './segment-chart-options';

const colours = { primary: '#111', tertiary: '#222', text: '#333', grid: '#444', surface: '#fff' };
// Invented segments: observed and expected counts chosen so the shares are easy to read by hand.
const row = (segment: string, rank: number | undefined, observed = [30, 70]): SegmentRow => ({
  segment,
  n: observed[0] + observed[1],
  rank,
  significant: rank === 1,
  drivers: [],
  categories: [
    { label: 'a', observed: observed[0], expected: 50 },
    { label: 'b', observed: observed[1], expected: 50 },
  ],
});

describe('segmentChartOptions', () => {
  it('draws one panel per tested segment in rank order, with shares of its own N', () => {
    const options = segmentChartOptions([row('north', 1), row('south', 2, [50, 50]), { ...row('empty', undefined), categories: [] }], colours) as {
      title: Array<{ text: string }>;
      series: Array<{ name: string; data: number[]; xAxisIndex: number }>;
      grid: unknown[];
    };
    expect(options.title.map((title) => title.text)).toEqual(['1. north — departs', '2. south']);
    expect(options.grid).toHaveLength(2);
    expect(options.series.filter((series) => series.xAxisIndex === 0).map((series) => [series.name, series.data])).toEqual([
      ['Observed share', [0.3, 0.7]],
      ['Expected share', [0.5, 0.5]],
    ]);
  });

  it('keeps at most twelve panels', () => {
    const many = Array.from({ length: 20 }, (_, i) => row(`s${i}`, i + 1));
    expect(panelRows(many)).toHaveLength(MAX_PANELS);
  });
});
