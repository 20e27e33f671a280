import type { AnalysisSpec } from '@tallyfit/engine';
import { parsePastedCounts } from './data-step/pasted-counts';
import { buildHypothesis, draftFromHypothesis } from './hypothesis-step/hypothesis-draft';
import { buildOptions } from './options-step/analysis-options';
import { optionsDraftOf, pastedText } from './prefill';

// Invented counts: a three-way sign-up split checked against 50/30/20 shares.
const spec: AnalysisSpec = {
  observed: { labels: ['web, desktop', 'web phone', 'app'], counts: [512, 290, 198] },
  hypothesis: { kind: 'proportions', values: [0.5, 0.3, 0.2] },
  tests: ['pearson', 'exact'],
  exact: { ordering: 'llr', method: 'monte-carlo', samples: 20000, seed: 7 },
  williams: true,
  posthoc: { adjust: 'bonferroni' },
  intervals: { method: 'goodman', level: 0.9 },
  alpha: 0.01,
};

describe('change and re-run starts from what was run', () => {
  it('gives the counts back as pasted text that reads as the same counts', () => {
    const outcome = parsePastedCounts(pastedText(spec.observed));
    expect(outcome).toMatchObject({ ok: true, data: spec.observed, skippedHeading: false });
  });

  it('gives every kind of hypothesis back as a draft that builds the same hypothesis', () => {
    const observed = { labels: ['north', 'centre', 'south'], counts: [500, 300, 200] };
    for (const hypothesis of [
      spec.hypothesis,
      { kind: 'equal' } as const,
      { kind: 'ratio', values: [2, 1, 1] } as const,
      { kind: 'counts', values: [500, 300, 200] } as const,
      { kind: 'distribution', family: 'normal', params: { mean: 1, sd: 2 }, breaks: [0, 2] } as const,
    ]) {
      expect(buildHypothesis(draftFromHypothesis(hypothesis), observed)).toEqual({ ok: true, hypothesis });
    }
  });

  it('gives the options back as a draft that builds the same options, so the re-run tests the same way', () => {
    const { observed: _observed, hypothesis: _hypothesis, ...options } = spec;
    expect(buildOptions(optionsDraftOf(options))).toEqual({ ok: true, options });
    // The defaults stay defaults: a spec that named no tests lets Tallyfit choose again.
    expect(optionsDraftOf({}).automaticTests).toBe(true);
  });
});
