import { analyze } from '../analyze';
import { EngineInputError } from '../spec/engine-input-error';
import reference from '../../testing/fixtures/noncentrality-interval.json';
import { expectClose } from '../../testing/expect-close';
import { noncentralityInterval } from './noncentrality-interval';

// Reference values: tools/fixtures/noncentrality-interval-reference.py (SciPy and mpmath; versions in the fixture).
describe('noncentrality intervals at any size of statistic', () => {
  it.each(reference.intervals)('X² = $statistic, df = $df ($source)', ({ statistic, df, low, high }) => {
    const interval = noncentralityInterval(statistic, df, 0.95);
    expectClose(interval.low, low, { relative: 1e-9 }, 'low');
    expectClose(interval.high, high, { relative: 1e-9 }, 'high');
  });

  // Before the large-noncentrality route this spec took about a minute (the tail sum is O(√λ)
  // terms per evaluation) and ran past jest's time limit; its speed is measured in tools/bench.
  it('gives the effect-size interval for an expected share of 1e-14', () => {
    const { values, counts, w, wLow, wHigh } = reference.analysis;
    const result = analyze({ observed: { labels: ['a', 'b'], counts }, hypothesis: { kind: 'proportions', values }, tests: ['pearson'] });
    expectClose(result.effectSize.w, w, { relative: 1e-12 }, 'w');
    expectClose(result.effectSize.interval?.low ?? NaN, wLow, { relative: 1e-9 }, 'low');
    expectClose(result.effectSize.interval?.high ?? NaN, wHigh, { relative: 1e-9 }, 'high');
  });

  it('refuses an expected share so small that the statistic overflows, naming the category', () => {
    const run = () =>
      analyze({ observed: { labels: ['a', 'b'], counts: [1, 2] }, hypothesis: { kind: 'proportions', values: [1e-320, 1] }, tests: ['pearson'] });
    expect(run).toThrow(EngineInputError);
    expect(run).toThrow(/hypothesis\.values\.0: .*"a".*too small/);
  });
});

describe("Cohen's w interval", () => {
  // Counts almost exactly at Benford's shares (N = 20,000): X² is far below the central 2.5% point
  // for 8 df, where the inverted noncentrality interval is empty and used to print as [0, 0].
  it('always contains the w it is printed beside', () => {
    const counts = [6021, 3522, 2499, 1938, 1584, 1339, 1160, 1023, 914];
    const result = analyze({
      observed: { labels: counts.map((_, index) => String(index + 1)), counts },
      hypothesis: { kind: 'distribution', family: 'benford' },
    });
    const { w, interval } = result.effectSize;
    expect(interval?.low ?? NaN).toBeLessThanOrEqual(w);
    expect(interval?.high ?? NaN).toBeGreaterThanOrEqual(w);
  });
});
