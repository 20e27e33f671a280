import { z } from 'zod';
import { personRefSchema } from './people-ref';

/** A withdrawal is the author taking a submission back to draft before anyone decided. */
export const REVIEW_DECISIONS = ['submitted', 'signed_off', 'returned', 'withdrawn'] as const;
export const reviewDecisionSchema = z.enum(REVIEW_DECISIONS);

const comment = z.string().trim().max(5000, { message: 'comment must be at most 5000 characters' });

export const submitForReviewRequestSchema = z.object({ comment: comment.optional() });
export const withdrawSubmissionRequestSchema = z.object({ comment: comment.optional() });
export const signOffRequestSchema = z.object({ comment: comment.optional() });
/** Returning an analysis needs a reason, so its author knows what to change. */
export const returnAnalysisRequestSchema = z.object({
  comment: comment.min(1, { message: 'comment must say why the analysis is returned' }),
});

export const reviewSchema = z.object({
  id: z.number().int(),
  analysisId: z.number().int(),
  decision: reviewDecisionSchema,
  comment: z.string().nullable(),
  by: personRefSchema,
  createdAt: z.string(),
});
export type Review = z.infer<typeof reviewSchema>;

export const createCommentRequestSchema = z.object({
  body: z.string().trim().min(1, { message: 'body must not be empty' }).max(5000, { message: 'body must be at most 5000 characters' }),
});
export type CreateCommentRequest = z.infer<typeof createCommentRequestSchema>;

export const commentSchema = z.object({
  id: z.number().int(),
  analysisId: z.number().int(),
  body: z.string(),
  author: personRefSchema,
  createdAt: z.string(),
});
export type Comment = z.infer<typeof commentSchema>;
