/**
 * The "merge the sparse categories" remedy: the spec of a new run in which the groups the
 * assumption check proposed are counted as one category each. The engine's `mergeCategories`
 * does the merge, so the expectation keeps its meaning (ratio terms and shares summed, a fitted
 * family's shares and estimated parameters kept) and the write-up names what was merged.
 */
import { mergeCategories, type AnalysisSpec, type MergePlan } from '@tallyfit/engine';

export interface MergedRun {
  spec: AnalysisSpec;
  /** one line per merged group, e.g. `"A", "B" → "A + B"` */
  lines: string[];
  /** the engine's sentence for the methods paragraph */
  note: string;
}

export function mergedRun(spec: AnalysisSpec, plan: MergePlan): MergedRun {
  const { spec: merged, note } = mergeCategories(spec, plan);
  const lines = plan.groups.map((group) => `${group.members.map((member) => `“${member}”`).join(', ')} → “${group.label}”`);
  return { spec: merged, lines, note };
}

/** The "use the exact test" remedy: the same spec with the exact test added to the tests run. */
export function withExactTest(spec: AnalysisSpec): AnalysisSpec {
  const tests = spec.tests ?? ['pearson', 'g'];
  return { ...spec, tests: tests.includes('exact') ? tests : [...tests, 'exact'] };
}
