import type { Comment, Review } from '@tallyfit/contracts';

/** One line of an analysis's conversation: a comment, or a review decision with its reason. */
export interface ThreadEntry {
  key: string;
  kind: 'comment' | 'decision';
  who: string;
  at: string;
  /** For decisions: what was decided, in words. */
  headline: string | null;
  body: string | null;
}

const DECISION_WORDS: Record<Review['decision'], string> = {
  submitted: 'submitted it for review',
  signed_off: 'signed it off',
  returned: 'returned it for changes',
  withdrawn: 'withdrew the submission',
};

/** Comments and review decisions in one timeline, oldest first (ties keep decisions first). */
export function threadEntries(comments: readonly Comment[], reviews: readonly Review[]): ThreadEntry[] {
  const decisions: ThreadEntry[] = reviews.map((review) => ({
    key: `review-${review.id}`,
    kind: 'decision',
    who: review.by.name,
    at: review.createdAt,
    headline: DECISION_WORDS[review.decision],
    body: review.comment,
  }));
  const notes: ThreadEntry[] = comments.map((comment) => ({
    key: `comment-${comment.id}`,
    kind: 'comment',
    who: comment.author.name,
    at: comment.createdAt,
    headline: null,
    body: comment.body,
  }));
  return [...decisions, ...notes].sort((a, b) => Date.parse(a.at) - Date.parse(b.at));
}
