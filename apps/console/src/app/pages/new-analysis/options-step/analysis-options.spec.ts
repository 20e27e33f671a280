import { buildOptions, DEFAULT_OPTIONS, type OptionsDraft } from './analysis-options';

const draft = (overrides: Partial<OptionsDraft>): OptionsDraft => ({ ...DEFAULT_OPTIONS, ...overrides });

describe('buildOptions', () => {
  it('leaves the choice of tests to the engine by default', () => {
    expect(buildOptions(DEFAULT_OPTIONS)).toEqual({
      ok: true,
      options: {
        exact: { ordering: 'probability', method: 'auto' },
        posthoc: { adjust: 'holm' },
        intervals: { method: 'wilson', level: 0.95 },
        alpha: 0.05,
      },
    });
  });

  it('sends the chosen tests, Williams’ correction and simulation settings', () => {
    const outcome = buildOptions(
      draft({
        automaticTests: false,
        tests: { pearson: false, g: true, exact: true, 'cressie-read': false },
        exactMethod: 'monte-carlo',
        samples: 20000,
        seed: 7,
        williams: true,
        adjust: 'bonferroni',
        intervalMethod: 'sison-glaz',
        alpha: 0.01,
      }),
    );
    expect(outcome).toEqual({
      ok: true,
      options: {
        tests: ['g', 'exact'],
        exact: { ordering: 'probability', method: 'monte-carlo', samples: 20000, seed: 7 },
        williams: true,
        posthoc: { adjust: 'bonferroni' },
        intervals: { method: 'sison-glaz', level: 0.95 },
        alpha: 0.01,
      },
    });
  });

  it('leaves out exact settings when the exact test cannot run', () => {
    const outcome = buildOptions(draft({ automaticTests: false, tests: { pearson: true, g: false, exact: false, 'cressie-read': false } }));
    expect(outcome.ok && outcome.options.exact).toBeUndefined();
  });

  // The messages are the engine's own (its spec schema), shown as they are.
  it('says what is wrong with each setting', () => {
    const outcome = buildOptions(
      draft({
        automaticTests: false,
        tests: { pearson: false, g: false, exact: false, 'cressie-read': false },
        alpha: 1,
        intervalLevel: null,
      }),
    );
    expect(outcome).toEqual({
      ok: false,
      errors: [
        'tests must name at least one test',
        'intervals.level must be a finite number',
        'alpha must be below 1',
      ],
    });
    expect(buildOptions(draft({ exactMethod: 'monte-carlo', samples: 50, seed: -1 }))).toEqual({
      ok: false,
      errors: ['exact.samples must be at least 100', 'exact.seed must not be negative'],
    });
  });
});
