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
import { anyRole, rolesAccess, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import {
  addStudyMember,
  createStudy,
  getStudy,
  listStudies,
  removeStudyMember,
  updateStudy,
  updateStudyMember,
} from './studies.service';

/** Admins and owners manage; the route lets through every role that can be an owner. */
const managers = rolesAccess('admin', 'analyst');

export function studiesRoutes(db: Knex): RouteDefinition[] {
  return [
    {
      method: 'get',
      path: '/studies',
      access: anyRole,
      summary: 'The studies the caller may read (leads and admins: all), by name',
      request: { query: listStudiesQuerySchema },
      responses: { 200: z.array(studySchema) },
      handler: async (req, res) => {
        const query = parseInput(listStudiesQuerySchema, req.query, 'query');
        res.json(await listStudies(db, req.user!, query.includeArchived));
      },
    },
    {
      method: 'post',
      path: '/studies',
      access: rolesAccess('admin', 'analyst'),
      summary: 'Create a study; its creator becomes its owner',
      request: { body: createStudyRequestSchema },
      responses: { 201: studyDetailSchema },
      handler: async (req, res) => {
        const body = parseInput(createStudyRequestSchema, req.body, 'study');
        res.status(201).json(await createStudy(db, req.user!, body));
      },
    },
    {
      method: 'get',
      path: '/studies/:id',
      access: anyRole,
      summary: 'One study with its members',
      request: { params: idParamsSchema },
      responses: { 200: studyDetailSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        res.json(await getStudy(db, req.user!, id));
      },
    },
    {
      method: 'patch',
      path: '/studies/:id',
      access: managers,
      summary: 'Rename, describe, archive or restore a study (its owners and admins)',
      request: { params: idParamsSchema, body: updateStudyRequestSchema },
      responses: { 200: studyDetailSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const body = parseInput(updateStudyRequestSchema, req.body, 'study change');
        res.json(await updateStudy(db, req.user!, id, body));
      },
    },
    {
      method: 'post',
      path: '/studies/:id/members',
      access: managers,
      summary: 'Add a person to a study with a study role',
      request: { params: idParamsSchema, body: addStudyMemberRequestSchema },
      responses: { 201: studyDetailSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const body = parseInput(addStudyMemberRequestSchema, req.body, 'member');
        res.status(201).json(await addStudyMember(db, req.user!, id, body));
      },
    },
    {
      method: 'patch',
      path: '/studies/:id/members/:userId',
      access: managers,
      summary: "Change a member's role in the study",
      request: { params: studyMemberParamsSchema, body: updateStudyMemberRequestSchema },
      responses: { 200: studyDetailSchema },
      handler: async (req, res) => {
        const { id, userId } = parseInput(studyMemberParamsSchema, req.params, 'path');
        const body = parseInput(updateStudyMemberRequestSchema, req.body, 'member change');
        res.json(await updateStudyMember(db, req.user!, id, userId, body.studyRole));
      },
    },
    {
      method: 'delete',
      path: '/studies/:id/members/:userId',
      access: managers,
      summary: 'Remove a person from a study',
      request: { params: studyMemberParamsSchema },
      responses: { 204: { description: 'removed' } },
      handler: async (req, res) => {
        const { id, userId } = parseInput(studyMemberParamsSchema, req.params, 'path');
        await removeStudyMember(db, req.user!, id, userId);
        res.status(204).end();
      },
    },
  ];
}
