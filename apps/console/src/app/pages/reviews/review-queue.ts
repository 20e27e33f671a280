import type { AnalysisSummary } from '@tallyfit/contracts';

/**
 * A reviewer's queue: the analyses waiting for review that they may decide on (never their own
 * work), the longest-waiting first.
 */
export function reviewQueue(waiting: readonly AnalysisSummary[], reviewerId: number | null): AnalysisSummary[] {
  return waiting
    .filter((analysis) => analysis.status === 'in_review' && analysis.isLatest && analysis.author.id !== reviewerId)
    .sort((a, b) => Date.parse(a.updatedAt) - Date.parse(b.updatedAt) || a.id - b.id);
}
