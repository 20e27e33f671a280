/**
 * Merge categories of a spec according to a plan (for instance the plan that the assumption
 * check proposes). Returns the new spec — whose `mergedCategories` makes the write-up say what was
 * merged — and a note in plain words.
 *
 * The hypothesis is carried over so that it still means the same thing: ratio terms, proportions
 * and expected counts are summed within each merged group; equal shares become a ratio of group
 * sizes; a fitted distribution becomes the proportions it gave before merging, with its estimated
 * parameters still counted against the degrees of freedom (so estimates come from the unmerged
 * frequencies, as before).
 */
import { resolveHypothesis } from '../hypothesis/resolve-hypothesis';
import type { MergePlan } from '../result/analysis-result';
import type { AnalysisSpec, Hypothesis } from '../spec/analysis-spec';
import { EngineInputError, type InputIssue } from '../spec/engine-input-error';
import { parseAnalysisSpec } from '../spec/parse-analysis-spec';

export interface MergeOutcome {
  spec: AnalysisSpec;
  note: string;
}

interface Grouping {
  /** for each new category: its label and the old positions it combines */
  categories: { label: string; members: number[] }[];
}

function planGrouping(labels: readonly string[], plan: MergePlan): Grouping {
  const issues: InputIssue[] = [];
  const position = new Map(labels.map((label, index) => [label, index]));
  const groupOf = new Map<number, number>();
  if (!plan || !Array.isArray(plan.groups) || plan.groups.length === 0) {
    throw EngineInputError.at('plan.groups', 'the plan must list at least one group of categories to merge');
  }
  plan.groups.forEach((group, g) => {
    if (!group || typeof group.label !== 'string' || group.label.trim() === '') {
      issues.push({ path: `plan.groups.${g}.label`, message: 'each merged category needs a non-empty label' });
    }
    if (!group || !Array.isArray(group.members) || group.members.length < 2) {
      issues.push({ path: `plan.groups.${g}.members`, message: 'a merged category needs at least 2 members' });
      return;
    }
    group.members.forEach((member, m) => {
      const index = position.get(member);
      if (index === undefined) {
        issues.push({ path: `plan.groups.${g}.members.${m}`, message: `there is no category "${member}"` });
      } else if (groupOf.has(index)) {
        issues.push({ path: `plan.groups.${g}.members.${m}`, message: `category "${member}" is already in another group` });
      } else {
        groupOf.set(index, g);
      }
    });
  });
  if (issues.length > 0) throw new EngineInputError(issues);
  const categories: Grouping['categories'] = [];
  const emitted = new Set<number>();
  labels.forEach((label, index) => {
    const g = groupOf.get(index);
    if (g === undefined) {
      categories.push({ label, members: [index] });
    } else if (!emitted.has(g)) {
      emitted.add(g);
      const members = labels.map((_, i) => i).filter((i) => groupOf.get(i) === g);
      categories.push({ label: plan.groups[g].label, members });
    }
  });
  const seen = new Set<string>();
  categories.forEach((category) => {
    if (seen.has(category.label)) {
      issues.push({ path: 'plan.groups', message: `the merged label "${category.label}" clashes with another category` });
    }
    seen.add(category.label);
  });
  if (categories.length < 2) issues.push({ path: 'plan.groups', message: 'merging must leave at least 2 categories' });
  if (issues.length > 0) throw new EngineInputError(issues);
  return { categories };
}

function sumOver(values: readonly number[], members: readonly number[]): number {
  return members.reduce((sum, index) => sum + values[index], 0);
}

export function mergeCategories(input: AnalysisSpec, plan: MergePlan): MergeOutcome {
  const spec = parseAnalysisSpec(input);
  const resolved = resolveHypothesis(spec);
  const labels = resolved.cells?.labels ?? spec.observed.labels;
  const counts = resolved.cells?.counts ?? spec.observed.counts;
  const { categories } = planGrouping(labels, plan);
  const hypothesis = spec.hypothesis;
  const estimatedParameters = resolved.estimatedParameters;
  const keepEstimated = estimatedParameters > 0 ? { estimatedParameters } : {};
  let merged: Hypothesis;
  if (hypothesis.kind === 'equal') {
    merged = { kind: 'ratio', values: categories.map((c) => c.members.length), ...keepEstimated };
  } else if (hypothesis.kind === 'distribution') {
    merged = { kind: 'proportions', values: categories.map((c) => sumOver(resolved.shares, c.members)), ...keepEstimated };
  } else {
    merged = { kind: hypothesis.kind, values: categories.map((c) => sumOver(hypothesis.values, c.members)), ...keepEstimated };
  }
  const groups = categories
    .filter((category) => category.members.length > 1)
    .map((category) => ({ label: category.label, members: category.members.map((index) => labels[index]) }));
  const note = `Merged before testing: ${groups
    .map((group) => `${group.members.map((member) => `"${member}"`).join(', ')} into "${group.label}"`)
    .join('; ')}.${
    hypothesis.kind === 'distribution'
      ? ` The expected shares are those of ${resolved.description}, fitted before merging.`
      : ''
  }`;
  const next: AnalysisSpec = {
    ...spec,
    observed: { labels: categories.map((c) => c.label), counts: categories.map((c) => sumOver(counts, c.members)) },
    hypothesis: merged,
    mergedCategories: [...(spec.mergedCategories ?? []), ...groups],
    notes: [...(spec.notes ?? []), note],
  };
  return { spec: parseAnalysisSpec(next), note };
}
