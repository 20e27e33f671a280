import type { WatchBatch } from '@tallyfit/contracts';
import type { ChartColours } from '../../shared/charts/theme-colours';
import { logFloor, paddedRange, pLabel, sequentialPTimelineOptions, sharesTimelineOptions } from './timeline-options';

const colours: ChartColours = { primary: 'rgb(0, 105, 108)', tertiary: 'rgb(139, 90, 31)', text: 'rgb(0, 0, 0)', grid: 'rgb(200, 200, 200)', surface: 'rgb(255, 255, 255)' };

function batch(sequence: number, sequentialP: number, batchP: number | null, estimate: number): WatchBatch {
  return {
    id: sequence,
    watchId: 3,
    sequence,
    periodStart: '2026-12-02T09:00:00Z',
    periodEnd: '2026-12-02T10:00:00Z',
    counts: { control: 1, redesign: 1 },
    n: 2,
    idempotencyKey: `k${sequence}`,
    source: 'push',
    datasetId: null,
    analysisId: 100 + sequence,
    batchP,
    cumulativeN: 2 * sequence,
    sequentialP,
    logBayesFactor: 0,
    alarm: sequentialP < 0.05,
    shares: [
      { label: 'control', expected: 0.5, estimate, lower: estimate - 0.02, upper: estimate + 0.02 },
      { label: 'redesign', expected: 0.5, estimate: 1 - estimate, lower: 0.98 - estimate, upper: 1.02 - estimate },
    ],
    createdBy: null,
    createdAt: '2026-12-02T10:00:00Z',
  };
}

const series = (options: Record<string, unknown>) => options['series'] as { name: string; data: (number | null)[] }[];

describe('the watch timeline charts', () => {
  const batches = [batch(1, 1, 0.6, 0.5), batch(2, 0.2, 0.04, 0.52), batch(3, 0.003, null, 0.53)];

  it('draws the band as its floor plus its width, so the shaded area spans lower to upper', () => {
    const [floor, width, estimate, expected] = series(sharesTimelineOptions(batches, 'control', colours));
    expect(floor.data).toEqual([0.48, 0.5, 0.51]);
    width.data.forEach((value) => expect(value).toBeCloseTo(0.04, 12));
    expect(estimate.data).toEqual([0.5, 0.52, 0.53]);
    expect(expected.data).toEqual([0.5, 0.5, 0.5]);
  });

  it('puts the sequential p on a log axis reaching a decade below alpha, with the alpha line labelled', () => {
    const options = sequentialPTimelineOptions(batches, 0.05, colours);
    const [sequential, own] = series(options);
    expect(sequential.data).toEqual([1, 0.2, 0.003]);
    expect(own.data).toEqual([0.6, 0.04, null]);
    expect(options['yAxis']).toMatchObject({ type: 'log', max: 1 });
    expect((options['yAxis'] as { min: number }).min).toBeCloseTo(0.001, 15);
    const markLine = (sequential as unknown as { markLine: { data: unknown[]; label: { formatter: string } } }).markLine;
    expect(markLine.data).toEqual([{ yAxis: 0.05 }]);
    expect(markLine.label.formatter).toBe('alpha = 0.05');
  });

  it('writes axis values people can read', () => {
    expect(pLabel(0.05)).toBe('0.05');
    expect(pLabel(1)).toBe('1');
    expect(pLabel(1e-6)).toBe('1e-6');
    expect(logFloor(0.003)).toBeCloseTo(0.001, 15);
    expect(paddedRange([0.48, 0.55])).toEqual([0.47, 0.56]);
    expect(paddedRange([])).toEqual([0, 1]);
  });
});
