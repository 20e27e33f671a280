import type { AnalysisStatus } from '@tallyfit/contracts';

/** Review states as people read them. */
export const ANALYSIS_STATUS_WORDS: Record<AnalysisStatus, string> = {
  draft: 'Draft',
  in_review: 'Waiting for review',
  signed_off: 'Signed off',
  returned: 'Returned for changes',
};

/** The engine's test names as people read them. */
export const TEST_WORDS: Record<string, string> = {
  pearson: 'Pearson chi-square',
  g: 'G-test',
  exact: 'Exact multinomial',
  'cressie-read': 'Cressie–Read',
};

export function testWords(tests: readonly string[]): string {
  return tests.map((test) => TEST_WORDS[test] ?? test).join(', ');
}
