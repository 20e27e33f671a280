import { formatPValueAt, TEST_LABELS, type AnalysisResult, type AnalysisSpec, type TestName } from '@tallyfit/engine';
import type { AnalysisChanges } from '@tallyfit/contracts';

interface TestFigures {
  statistic: number | null;
  p: number;
}

function figuresByTest(result: AnalysisResult): Map<string, TestFigures> {
  const figures = new Map<string, TestFigures>();
  for (const [name, test] of Object.entries(result.tests) as Array<[string, { statistic?: number; p: number } | undefined]>) {
    if (test) figures.set(name, { statistic: test.statistic ?? null, p: test.p });
  }
  return figures;
}

const difference = (after: number | null | undefined, before: number | null | undefined): number | null =>
  after === null || after === undefined || before === null || before === undefined ? null : after - before;

/** A test's name as people read it (the engine's words, never the spec key). */
const testWord = (key: string) => (key in TEST_LABELS ? TEST_LABELS[key as TestName].name : key);

const sameJson = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

/** What differs between two specs, one sentence per kind of change. */
export function specChangeSentences(before: AnalysisSpec, after: AnalysisSpec): string[] {
  const sentences: string[] = [];
  if (!sameJson(before.observed.labels, after.observed.labels)) {
    sentences.push(`The categories changed from ${before.observed.labels.length} (${before.observed.labels.join(', ')}) to ${after.observed.labels.length} (${after.observed.labels.join(', ')}).`);
  } else if (!sameJson(before.observed.counts, after.observed.counts)) {
    sentences.push('The observed counts changed.');
  }
  if (!sameJson(before.hypothesis, after.hypothesis)) sentences.push('What was expected changed.');
  const testsBefore = new Set<string>(before.tests ?? []);
  const testsAfter = new Set<string>(after.tests ?? []);
  const added = [...testsAfter].filter((test) => !testsBefore.has(test)).map(testWord);
  const dropped = [...testsBefore].filter((test) => !testsAfter.has(test)).map(testWord);
  if (added.length) sentences.push(`Added: ${added.join(', ')}.`);
  if (dropped.length && testsAfter.size > 0) sentences.push(`No longer asked for: ${dropped.join(', ')}.`);
  if ((before.alpha ?? 0.05) !== (after.alpha ?? 0.05)) sentences.push(`The significance level changed from ${before.alpha ?? 0.05} to ${after.alpha ?? 0.05}.`);
  const { observed: _o1, hypothesis: _h1, tests: _t1, alpha: _a1, ...restBefore } = before;
  const { observed: _o2, hypothesis: _h2, tests: _t2, alpha: _a2, ...restAfter } = after;
  if (!sameJson(restBefore, restAfter)) sentences.push('Other options changed (exact test, corrections or intervals).');
  return sentences;
}

/** "= .018" or "< .001": a printed p with the relation it needs inside a sentence. */
const withRelation = (text: string) => (text.startsWith('<') || text.startsWith('>') ? text : `= ${text}`);

/** Compares a re-run with the version it re-ran: each test's statistic and p, the decision and the engine. */
export function compareRuns(
  previous: { id: number; engineVersion: string; spec: AnalysisSpec; result: AnalysisResult },
  next: { engineVersion: string; spec: AnalysisSpec; result: AnalysisResult },
): AnalysisChanges {
  const before = figuresByTest(previous.result);
  const after = figuresByTest(next.result);
  const names = [...new Set([...before.keys(), ...after.keys()])];
  const tests = names.map((test) => {
    const b = before.get(test) ?? null;
    const a = after.get(test) ?? null;
    return {
      test,
      before: b,
      after: a,
      statisticDifference: difference(a?.statistic, b?.statistic),
      pDifference: difference(a?.p, b?.p),
    };
  });
  const decision = {
    before: previous.result.conclusion.significant,
    after: next.result.conclusion.significant,
    changed: previous.result.conclusion.significant !== next.result.conclusion.significant,
  };
  const engineVersion = {
    before: previous.engineVersion,
    after: next.engineVersion,
    changed: previous.engineVersion !== next.engineVersion,
  };
  const specChanged = JSON.stringify(previous.spec) !== JSON.stringify(next.spec);

  // Plain sentences: only what changed, tests by their names, p as the page prints it.
  const summary: string[] = [];
  if (engineVersion.changed) summary.push(`Computed again with engine ${engineVersion.after} (it was ${engineVersion.before}).`);
  summary.push(...specChangeSentences(previous.spec, next.spec));
  const pBefore = (p: number) => formatPValueAt(p, previous.result.conclusion.alpha);
  const pAfter = (p: number) => formatPValueAt(p, next.result.conclusion.alpha);
  for (const change of tests) {
    const name = testWord(change.test);
    if (!change.before) summary.push(`${name} was run for the first time (p ${withRelation(pAfter(change.after!.p))}).`);
    else if (!change.after) summary.push(`${name} was not run this time.`);
    else if (pBefore(change.before.p) !== pAfter(change.after.p)) {
      summary.push(`${name}: p went from ${pBefore(change.before.p)} to ${pAfter(change.after.p)}.`);
    }
  }
  if (summary.length === 0) summary.push('Nothing changed: the same data, options and engine give the same figures.');
  summary.push(
    decision.changed
      ? `The decision changed: the difference is ${decision.after ? 'now' : 'no longer'} significant at the chosen level.`
      : `The decision is the same: the difference is ${decision.after ? 'significant' : 'not significant'} at the chosen level.`,
  );
  return { previousId: previous.id, engineVersion, specChanged, tests, decision, summary };
}
