/**
 * Results stored by engine 0.1.x keyed the Cressie–Read test `cressieRead` (in `tests`,
 * `report.lines` and `conclusion.test`); from 0.2.0 every key is the spec's test name,
 * `cressie-read`. Whoever reads stored results passes them through here, so older rows read like
 * new ones. Results already in the new form come back unchanged.
 */
import type { AnalysisResult } from './analysis-result';

const OLD_KEY = 'cressieRead';
const NEW_KEY = 'cressie-read';

function renameKey<T extends object>(record: T): T {
  if (!(OLD_KEY in record)) return record;
  const { [OLD_KEY]: value, ...rest } = record as Record<string, unknown>;
  return { ...rest, [NEW_KEY]: value } as T;
}

export function upgradeStoredResult(result: AnalysisResult): AnalysisResult {
  const conclusion = result.conclusion as { test: string };
  if (!(OLD_KEY in result.tests) && !(OLD_KEY in result.report.lines) && conclusion.test !== OLD_KEY) return result;
  return {
    ...result,
    tests: renameKey(result.tests),
    report: { ...result.report, lines: renameKey(result.report.lines) },
    conclusion: { ...result.conclusion, test: conclusion.test === OLD_KEY ? NEW_KEY : result.conclusion.test },
  };
}
