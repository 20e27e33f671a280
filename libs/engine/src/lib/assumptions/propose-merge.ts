/**
 * Propose merging sparse categories until Cochran's rule holds. The sparsest category is merged
 * with a neighbour: for ordered categories (values of a counted quantity) the adjacent one with
 * the smaller expected count, so merged cells stay contiguous ranges; for unordered categories the
 * next-sparsest one. Greedy and simple on purpose (common practice, no source): the analyst sees
 * the plan and decides. Returns undefined when no merge leaves at least one degree of freedom.
 */
import type { MergePlan } from '../result/analysis-result';
import { summariseExpectedCounts } from './cochran-rule';

interface Group {
  members: number[];
  expected: number;
}

function mergedLabel(labels: readonly string[], members: readonly number[], ordered: boolean): string {
  const names = members.map((index) => labels[index]);
  return ordered ? `${names[0]}–${names[names.length - 1]}` : names.join(' + ');
}

export function proposeMerge(
  labels: readonly string[],
  expected: readonly number[],
  ordered: boolean,
  estimatedParameters: number,
): MergePlan | undefined {
  let groups: Group[] = expected.map((e, index) => ({ members: [index], expected: e }));
  const minimumGroups = 2 + estimatedParameters;
  while (!summariseExpectedCounts(groups.map((g) => g.expected)).cochranOk) {
    if (groups.length <= minimumGroups) return undefined;
    let sparsest = 0;
    groups.forEach((group, index) => {
      if (group.expected < groups[sparsest].expected) sparsest = index;
    });
    let partner: number;
    if (ordered) {
      const left = sparsest - 1;
      const right = sparsest + 1;
      if (left < 0) partner = right;
      else if (right >= groups.length) partner = left;
      else partner = groups[left].expected <= groups[right].expected ? left : right;
    } else {
      partner = -1;
      groups.forEach((group, index) => {
        if (index !== sparsest && (partner < 0 || group.expected < groups[partner].expected)) partner = index;
      });
    }
    const [first, second] = sparsest < partner ? [sparsest, partner] : [partner, sparsest];
    const merged: Group = {
      members: [...groups[first].members, ...groups[second].members].sort((a, b) => a - b),
      expected: groups[first].expected + groups[second].expected,
    };
    groups = groups.filter((_, index) => index !== first && index !== second);
    groups.splice(first, 0, merged);
  }
  const mergedGroups = groups.filter((group) => group.members.length > 1);
  if (mergedGroups.length === 0) return undefined;
  return {
    groups: mergedGroups.map((group) => ({
      label: mergedLabel(labels, group.members, ordered),
      members: group.members.map((index) => labels[index]),
    })),
  };
}
