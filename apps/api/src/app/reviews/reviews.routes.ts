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
} from '@tallyfit/contracts';
import { anyRole, rolesAccess, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import { addComment, decideReview, listComments, listReviews } from './reviews.service';

const reviewers = rolesAccess('admin', 'lead');

export function reviewsRoutes(db: Knex): RouteDefinition[] {
  return [
    {
      method: 'post',
      path: '/analyses/:id/submit',
      access: rolesAccess('admin', 'analyst'),
      summary: 'Submit an analysis for review (its author)',
      tag: 'reviews',
      request: { params: idParamsSchema, body: submitForReviewRequestSchema },
      responses: { 200: analysisRecordSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const body = parseInput(submitForReviewRequestSchema, req.body ?? {}, 'submission');
        res.json(await decideReview(db, req.user!, id, 'submitted', body.comment));
      },
    },
    {
      method: 'post',
      path: '/analyses/:id/sign-off',
      access: reviewers,
      summary: 'Sign off an analysis that is in review',
      tag: 'reviews',
      request: { params: idParamsSchema, body: signOffRequestSchema },
      responses: { 200: analysisRecordSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const body = parseInput(signOffRequestSchema, req.body ?? {}, 'sign-off');
        res.json(await decideReview(db, req.user!, id, 'signed_off', body.comment));
      },
    },
    {
      method: 'post',
      path: '/analyses/:id/return',
      access: reviewers,
      summary: 'Return an analysis in review to its author, saying why',
      tag: 'reviews',
      request: { params: idParamsSchema, body: returnAnalysisRequestSchema },
      responses: { 200: analysisRecordSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const body = parseInput(returnAnalysisRequestSchema, req.body, 'return');
        res.json(await decideReview(db, req.user!, id, 'returned', body.comment));
      },
    },
    {
      method: 'get',
      path: '/analyses/:id/reviews',
      access: anyRole,
      summary: 'The review decisions on an analysis, oldest first',
      tag: 'reviews',
      request: { params: idParamsSchema },
      responses: { 200: z.array(reviewSchema) },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        res.json(await listReviews(db, req.user!, id));
      },
    },
    {
      method: 'get',
      path: '/analyses/:id/comments',
      access: anyRole,
      summary: 'Comments on an analysis, oldest first',
      tag: 'reviews',
      request: { params: idParamsSchema },
      responses: { 200: z.array(commentSchema) },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        res.json(await listComments(db, req.user!, id));
      },
    },
    {
      method: 'post',
      path: '/analyses/:id/comments',
      access: anyRole,
      summary: 'Comment on an analysis the caller can read',
      tag: 'reviews',
      request: { params: idParamsSchema, body: createCommentRequestSchema },
      responses: { 201: commentSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const body = parseInput(createCommentRequestSchema, req.body, 'comment');
        res.status(201).json(await addComment(db, req.user!, id, body.body));
      },
    },
  ];
}
