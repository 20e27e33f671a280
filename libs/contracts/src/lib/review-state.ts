import type { AnalysisStatus } from './analyses';
import type { Review } from './reviews';

/** Review states as people read them: the same words on the page, in lists and in every export. */
export const REVIEW_STATE_WORDS: Record<AnalysisStatus, string> = {
  draft: 'Draft',
  in_review: 'Waiting for review',
  signed_off: 'Signed off',
  returned: 'Returned for changes',
};

/** What each review decision reads as in a history. */
export const REVIEW_DECISION_WORDS: Record<Review['decision'], string> = {
  submitted: 'Submitted for review',
  signed_off: 'Signed off',
  returned: 'Returned for changes',
  withdrawn: 'Submission withdrawn',
};

/** "2026-12-02 14:05 UTC": a time every reader places without guessing the time zone. */
export const utcTimeText = (iso: string): string => `${new Date(iso).toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/**
 * The review facts of an analysis in sentences: its state, and the decision that put it there
 * (who signed off and when; who returned it, when and why). The result page, the Markdown report
 * and the PDF all print these lines, so they say the same thing.
 */
export function reviewStateLines(status: AnalysisStatus, reviews: readonly Review[]): string[] {
  const lines = [`Review state: ${REVIEW_STATE_WORDS[status]}.`];
  const latest = reviews.at(-1);
  if (status === 'signed_off' && latest?.decision === 'signed_off') {
    lines.push(`Signed off by ${latest.by.name} on ${utcTimeText(latest.createdAt)}.`);
    if (latest.comment) lines.push(`Sign-off note: ${latest.comment}`);
  } else if (status === 'returned' && latest?.decision === 'returned') {
    lines.push(`Returned by ${latest.by.name} on ${utcTimeText(latest.createdAt)}.`);
    if (latest.comment) lines.push(`Reason: ${latest.comment}`);
  } else if (status === 'in_review' && latest?.decision === 'submitted') {
    lines.push(`Submitted by ${latest.by.name} on ${utcTimeText(latest.createdAt)}.`);
  }
  return lines;
}
