import type { AnalysisStatus } from '@tallyfit/contracts';
import { TEST_LABELS } from '@tallyfit/engine';

/** Review states as people read them. */
export const ANALYSIS_STATUS_WORDS: Record<AnalysisStatus, string> = {
  draft: 'Draft',
  in_review: 'Waiting for review',
  signed_off: 'Signed off',
  returned: 'Returned for changes',
};

/** The engine's test names as people read them: the engine's own short labels. */
export const TEST_WORDS: Record<string, string> = Object.fromEntries(
  Object.entries(TEST_LABELS).map(([test, label]) => [test, label.short]),
);

export function testWords(tests: readonly string[]): string {
  return tests.map((test) => TEST_WORDS[test] ?? test).join(', ');
}
