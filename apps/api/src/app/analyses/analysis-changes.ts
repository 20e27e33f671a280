import type { AnalysisResult } from '@tallyfit/engine';
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

const pText = (p: number) => (p < 0.001 ? p.toExponential(2) : p.toFixed(4));

/** Compares a re-run with the version it re-ran: each test's statistic and p, the decision and the engine. */
export function compareRuns(
  previous: { id: number; engineVersion: string; spec: unknown; result: AnalysisResult },
  next: { engineVersion: string; spec: unknown; result: AnalysisResult },
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

  const summary: string[] = [];
  summary.push(engineVersion.changed ? `The engine changed from ${engineVersion.before} to ${engineVersion.after}.` : `Same engine (${engineVersion.after}).`);
  summary.push(specChanged ? 'The spec was changed for this run.' : 'The spec is unchanged.');
  for (const change of tests) {
    if (!change.before) summary.push(`${change.test}: newly run (p = ${pText(change.after!.p)}).`);
    else if (!change.after) summary.push(`${change.test}: no longer run.`);
    else if (change.pDifference === 0 && (change.statisticDifference ?? 0) === 0) summary.push(`${change.test}: same statistic and p-value.`);
    else summary.push(`${change.test}: p-value went from ${pText(change.before.p)} to ${pText(change.after.p)}.`);
  }
  summary.push(
    decision.changed
      ? `The decision changed: the difference is ${decision.after ? 'now' : 'no longer'} significant at the chosen level.`
      : 'The decision is unchanged.',
  );
  return { previousId: previous.id, engineVersion, specChanged, tests, decision, summary };
}
