/**
 * Cases whose work must not grow with the size of the numbers (issue: engine work bounded by the
 * input): the exact binomial test at enormous n beside the term-by-term tail sum it replaced, and
 * the effect-size interval at tiny expected shares beside an ordinary three-category analysis.
 */
import { analyze, binomialTest } from '@tallyfit/engine';
import { binomialLogProbability } from '../../../libs/engine/src/lib/binomial/binomial-log-probability';

export interface BoundedWorkCase {
  name: string;
  run: () => unknown;
}

/** ln P(X <= x) by adding every term from x down until they stop mattering: the method replaced in 0.2.0. */
function termByTermLowerTail(x: number, n: number, p: number): number {
  const odds = p / (1 - p);
  let term = 1;
  let sum = 1;
  for (let j = x; j > 0; j--) {
    term *= j / (n - j + 1) / odds;
    const next = sum + term;
    if (next === sum) break;
    sum = next;
  }
  return binomialLogProbability(x, n, p) + Math.log(sum);
}

const tinyShare = (share: number) => () =>
  analyze({ observed: { labels: ['a', 'b'], counts: [1, 2] }, hypothesis: { kind: 'proportions', values: [share, 1] }, tests: ['pearson'] });

export const boundedWorkCases: BoundedWorkCase[] = [
  { name: 'binomial test, x = 1e15, n = 2e15 + 1e8', run: () => binomialTest(1e15, 2e15 + 1e8, 0.5) },
  { name: 'one tail term by term (replaced), same x and n', run: () => termByTermLowerTail(1e15, 2e15 + 1e8, 0.5) },
  { name: 'binomial test, x = 5,100, n = 10,000', run: () => binomialTest(5100, 10000, 0.5) },
  { name: 'Pearson, 3 categories (baseline)', run: () => analyze({ observed: { labels: ['a', 'b', 'c'], counts: [30, 20, 10] }, hypothesis: { kind: 'equal' }, tests: ['pearson'] }) },
  { name: 'Pearson, expected share 1e-10', run: tinyShare(1e-10) },
  { name: 'Pearson, expected share 1e-12', run: tinyShare(1e-12) },
  { name: 'Pearson, expected share 1e-14', run: tinyShare(1e-14) },
];
