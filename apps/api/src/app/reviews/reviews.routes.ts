import type { Knex } from 'knex';
import { z } from 'zod';
import {
  analysisRecordSchema,
  commentSchema,
  createCommentRequestSchema,
  idParamsSchema,
  returnAnalysisRequestSchema,
  reviewSchema,
  signOffRequestSchema,
  submitForReviewRequestSchema,
  withdrawSubmissionRequestSchema,
} from '@tallyfit/contracts';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import type { NotificationMail } from '../notifications/notifications.service';
import { addComment, decideReview, listComments, listReviews } from './reviews.service';

/** The review decisions, each its own route: who may take it, and what its body must hold. */
const DECISIONS = [
  { decision: 'submitted', path: 'submit', access: 'analyses.run', summary: 'Submit an analysis for review (its author)', body: submitForReviewRequestSchema },
  {
    decision: 'withdrawn',
    path: 'withdraw',
    access: 'analyses.run',
    summary: 'Withdraw a submission while it waits for review, back to draft (its author)',
    body: withdrawSubmissionRequestSchema,
  },
  { decision: 'signed_off', path: 'sign-off', access: 'analyses.review', summary: 'Sign off an analysis that is in review', body: signOffRequestSchema },
  { decision: 'returned', path: 'return', access: 'analyses.review', summary: 'Return an analysis in review to its author, saying why', body: returnAnalysisRequestSchema },
] as const;

export function reviewsRoutes(db: Knex, delivery: NotificationMail): RouteDefinition[] {
  return [
    ...DECISIONS.map(({ decision, path, access, summary, body }) =>
      defineRoute({
        method: 'post',
        path: `/analyses/:id/${path}`,
        access,
        summary,
        tag: 'reviews',
        request: { params: idParamsSchema, body },
        responses: { 200: analysisRecordSchema },
        handler: ({ params, body: { comment }, user }) => decideReview(db, user, params.id, decision, comment, delivery),
      }),
    ),
    defineRoute({
      method: 'get',
      path: '/analyses/:id/reviews',
      access: 'analyses.read',
      summary: 'The review decisions on an analysis, oldest first',
      tag: 'reviews',
      request: { params: idParamsSchema },
      responses: { 200: z.array(reviewSchema) },
      handler: ({ params, user }) => listReviews(db, user, params.id),
    }),
    defineRoute({
      method: 'get',
      path: '/analyses/:id/comments',
      access: 'analyses.read',
      summary: 'Comments on an analysis, oldest first',
      tag: 'reviews',
      request: { params: idParamsSchema },
      responses: { 200: z.array(commentSchema) },
      handler: ({ params, user }) => listComments(db, user, params.id),
    }),
    defineRoute({
      method: 'post',
      path: '/analyses/:id/comments',
      access: 'analyses.comment',
      summary: 'Comment on an analysis the caller can read',
      tag: 'reviews',
      request: { params: idParamsSchema, body: createCommentRequestSchema },
      responses: { 201: commentSchema },
      handler: ({ params, body, user }) => addComment(db, user, params.id, body.body),
    }),
  ];
}
