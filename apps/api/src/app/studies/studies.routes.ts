import type { Knex } from 'knex';
import { z } from 'zod';
import {
  addStudyMemberRequestSchema,
  createStudyRequestSchema,
  idParamsSchema,
  listStudiesQuerySchema,
  studyDetailSchema,
  studyMemberParamsSchema,
  studySchema,
  updateStudyMemberRequestSchema,
  updateStudyRequestSchema,
} from '@tallyfit/contracts';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import {
  addStudyMember,
  createStudy,
  getStudy,
  listStudies,
  removeStudyMember,
  updateStudy,
  updateStudyMember,
} from './studies.service';

export function studiesRoutes(db: Knex): RouteDefinition[] {
  return [
    defineRoute({
      method: 'get',
      path: '/studies',
      access: 'studies.read',
      summary: 'The studies the caller may read (leads and admins: all), by name',
      request: { query: listStudiesQuerySchema },
      responses: { 200: z.array(studySchema) },
      handler: ({ query, user }) => listStudies(db, user, query.includeArchived),
    }),
    defineRoute({
      method: 'post',
      path: '/studies',
      access: 'studies.create',
      summary: 'Create a study; its creator becomes its owner',
      request: { body: createStudyRequestSchema },
      responses: { 201: studyDetailSchema },
      handler: ({ body, user }) => createStudy(db, user, body),
    }),
    defineRoute({
      method: 'get',
      path: '/studies/:id',
      access: 'studies.read',
      summary: 'One study with its members',
      request: { params: idParamsSchema },
      responses: { 200: studyDetailSchema },
      handler: ({ params, user }) => getStudy(db, user, params.id),
    }),
    defineRoute({
      method: 'patch',
      path: '/studies/:id',
      access: 'studies.manage',
      summary: 'Rename, describe, archive or restore a study (its owners and admins)',
      request: { params: idParamsSchema, body: updateStudyRequestSchema },
      responses: { 200: studyDetailSchema },
      handler: ({ params, body, user }) => updateStudy(db, user, params.id, body),
    }),
    defineRoute({
      method: 'post',
      path: '/studies/:id/members',
      access: 'studies.manage',
      summary: 'Add a person to a study with a study role',
      request: { params: idParamsSchema, body: addStudyMemberRequestSchema },
      responses: { 201: studyDetailSchema },
      handler: ({ params, body, user }) => addStudyMember(db, user, params.id, body),
    }),
    defineRoute({
      method: 'patch',
      path: '/studies/:id/members/:userId',
      access: 'studies.manage',
      summary: "Change a member's role in the study",
      request: { params: studyMemberParamsSchema, body: updateStudyMemberRequestSchema },
      responses: { 200: studyDetailSchema },
      handler: ({ params, body, user }) => updateStudyMember(db, user, params.id, params.userId, body.studyRole),
    }),
    defineRoute({
      method: 'delete',
      path: '/studies/:id/members/:userId',
      access: 'studies.manage',
      summary: 'Remove a person from a study',
      request: { params: studyMemberParamsSchema },
      responses: { 204: { description: 'removed' } },
      handler: ({ params, user }) => removeStudyMember(db, user, params.id, params.userId),
    }),
  ];
}
