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

export function reviewsRoutes(db: Knex, delivery: NotificationMail): RouteDefinition[] {
  return [
    defineRoute({
      method: 'post',
      path: '/analyses/:id/submit',
      access: 'analyses.run',
      summary: 'Submit an analysis for review (its author)',
      tag: 'reviews',
      request: { params: idParamsSchema, body: submitForReviewRequestSchema },
      responses: { 200: analysisRecordSchema },
      handler: async ({ params, body, user, res }) => {
        res.json(await decideReview(db, user, params.id, 'submitted', body.comment, delivery));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/analyses/:id/withdraw',
      access: 'analyses.run',
      summary: 'Withdraw a submission while it waits for review, back to draft (its author)',
      tag: 'reviews',
      request: { params: idParamsSchema, body: withdrawSubmissionRequestSchema },
      responses: { 200: analysisRecordSchema },
      handler: async ({ params, body, user, res }) => {
        res.json(await decideReview(db, user, params.id, 'withdrawn', body.comment, delivery));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/analyses/:id/sign-off',
      access: 'analyses.review',
      summary: 'Sign off an analysis that is in review',
      tag: 'reviews',
      request: { params: idParamsSchema, body: signOffRequestSchema },
      responses: { 200: analysisRecordSchema },
      handler: async ({ params, body, user, res }) => {
        res.json(await decideReview(db, user, params.id, 'signed_off', body.comment, delivery));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/analyses/:id/return',
      access: 'analyses.review',
      summary: 'Return an analysis in review to its author, saying why',
      tag: 'reviews',
      request: { params: idParamsSchema, body: returnAnalysisRequestSchema },
      responses: { 200: analysisRecordSchema },
      handler: async ({ params, body, user, res }) => {
        res.json(await decideReview(db, user, params.id, 'returned', body.comment, delivery));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/analyses/:id/reviews',
      access: 'analyses.read',
      summary: 'The review decisions on an analysis, oldest first',
      tag: 'reviews',
      request: { params: idParamsSchema },
      responses: { 200: z.array(reviewSchema) },
      handler: async ({ params, user, res }) => {
        res.json(await listReviews(db, user, params.id));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/analyses/:id/comments',
      access: 'analyses.read',
      summary: 'Comments on an analysis, oldest first',
      tag: 'reviews',
      request: { params: idParamsSchema },
      responses: { 200: z.array(commentSchema) },
      handler: async ({ params, user, res }) => {
        res.json(await listComments(db, user, params.id));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/analyses/:id/comments',
      access: 'analyses.comment',
      summary: 'Comment on an analysis the caller can read',
      tag: 'reviews',
      request: { params: idParamsSchema, body: createCommentRequestSchema },
      responses: { 201: commentSchema },
      handler: async ({ params, body, user, res }) => {
        res.status(201).json(await addComment(db, user, params.id, body.body));
      },
    }),
  ];
}
