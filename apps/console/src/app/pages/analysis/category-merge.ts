/**
 * The "merge the sparse categories" remedy: the spec of a new run in which the groups the
 * assumption check proposed are counted as one category each.
 *
 * The new spec is built from the result the person is looking at: each merged category's count is
 * the sum of its members' counts and its expected share the sum of their expected shares, so the
 * expectation means what it meant before (a fitted family keeps the shares fitted before merging,
 * and its estimated parameters still count against the degrees of freedom). The write-up names
 * the merge through `mergedCategories` and a note.
 */
import type { AnalysisResult, AnalysisSpec, MergePlan } from '@tallyfit/engine';

export interface MergedRun {
  spec: AnalysisSpec;
  /** one line per merged group, e.g. `"A", "B" → "A + B"` */
  lines: string[];
  note: string;
}

export function mergedRun(spec: AnalysisSpec, result: AnalysisResult, plan: MergePlan): MergedRun {
  const rows = result.categories;
  const groupOf = new Map<string, number>();
  plan.groups.forEach((group, index) => group.members.forEach((member) => groupOf.set(member, index)));
  for (const member of groupOf.keys()) {
    if (!rows.some((row) => row.label === member)) throw new Error(`the plan names a category "${member}" that the result does not have`);
  }
  const labels: string[] = [];
  const counts: number[] = [];
  const shares: number[] = [];
  const emitted = new Set<number>();
  for (const row of rows) {
    const group = groupOf.get(row.label);
    if (group === undefined) {
      labels.push(row.label);
      counts.push(row.observed);
      shares.push(row.expectedShare);
    } else if (!emitted.has(group)) {
      emitted.add(group);
      const members = rows.filter((candidate) => groupOf.get(candidate.label) === group);
      labels.push(plan.groups[group].label);
      counts.push(members.reduce((sum, member) => sum + member.observed, 0));
      shares.push(members.reduce((sum, member) => sum + member.expectedShare, 0));
    }
  }
  const lines = plan.groups.map((group) => `${group.members.map((member) => `“${member}”`).join(', ')} → “${group.label}”`);
  const note = `Merged before testing, because some expected counts were small: ${plan.groups
    .map((group) => `${group.members.map((member) => `"${member}"`).join(', ')} into "${group.label}"`)
    .join('; ')}.`;
  const estimated = result.hypothesis.estimatedParameters;
  const total = shares.reduce((sum, share) => sum + share, 0);
  const next: AnalysisSpec = {
    ...spec,
    observed: { labels, counts },
    hypothesis: {
      kind: 'proportions',
      // Shares of the engine's own result sum to 1 up to rounding; dividing by the total removes that noise.
      values: shares.map((share) => share / total),
      ...(estimated > 0 ? { estimatedParameters: estimated } : {}),
    },
    mergedCategories: [...(spec.mergedCategories ?? []), ...plan.groups.map((group) => ({ label: group.label, members: [...group.members] }))],
    notes: [...(spec.notes ?? []), note],
  };
  return { spec: next, lines, note };
}

/** The "use the exact test" remedy: the same spec with the exact test added to the tests run. */
export function withExactTest(spec: AnalysisSpec): AnalysisSpec {
  const tests = spec.tests ?? ['pearson', 'g'];
  return { ...spec, tests: tests.includes('exact') ? tests : [...tests, 'exact'] };
}
