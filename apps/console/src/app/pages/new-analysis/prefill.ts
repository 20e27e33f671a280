import type { AnalysisSpec, TestName } from '@tallyfit/engine';
import type { ParsedCounts } from './data-step/pasted-counts';
import { DEFAULT_OPTIONS, type OptionsDraft } from './options-step/analysis-options';

/**
 * "Change and re-run": a stored spec turned back into what each step of the flow shows, so the
 * person starts from exactly what was run and changes only what they mean to.
 */

/** The counts as two pasted columns (tab between category and count), one category a line. */
export function pastedText(observed: ParsedCounts): string {
  return observed.labels.map((label, index) => `${label}\t${observed.counts[index]}`).join('\n');
}

/** The options step's draft for a stored spec's options. */
export function optionsDraftOf(spec: Omit<AnalysisSpec, 'observed' | 'hypothesis'>): OptionsDraft {
  const chosen = spec.tests as readonly TestName[] | undefined;
  return {
    automaticTests: !chosen,
    tests: chosen
      ? { pearson: chosen.includes('pearson'), g: chosen.includes('g'), exact: chosen.includes('exact'), 'cressie-read': chosen.includes('cressie-read') }
      : { ...DEFAULT_OPTIONS.tests },
    exactOrdering: spec.exact?.ordering ?? DEFAULT_OPTIONS.exactOrdering,
    exactMethod: spec.exact?.method ?? DEFAULT_OPTIONS.exactMethod,
    samples: spec.exact?.samples ?? DEFAULT_OPTIONS.samples,
    seed: spec.exact?.seed ?? DEFAULT_OPTIONS.seed,
    williams: spec.williams ?? DEFAULT_OPTIONS.williams,
    adjust: spec.posthoc?.adjust ?? DEFAULT_OPTIONS.adjust,
    intervalMethod: spec.intervals?.method ?? DEFAULT_OPTIONS.intervalMethod,
    intervalLevel: spec.intervals?.level ?? DEFAULT_OPTIONS.intervalLevel,
    alpha: spec.alpha ?? DEFAULT_OPTIONS.alpha,
  };
}
