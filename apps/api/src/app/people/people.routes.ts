import type { Knex } from 'knex';
import { z } from 'zod';
import { createPersonRequestSchema, idParamsSchema, personSchema, updatePersonRequestSchema } from '@tallyfit/contracts';
import { anyRole, rolesAccess, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import { createPerson, getPerson, listPeople, updatePerson } from './people.service';

const admins = rolesAccess('admin');
const directoryEntrySchema = personSchema.pick({ id: true, name: true, email: true, role: true });

export function peopleRoutes(db: Knex): RouteDefinition[] {
  return [
    {
      method: 'get',
      path: '/people',
      access: admins,
      summary: 'Everyone who can sign in, including disabled accounts',
      responses: { 200: z.array(personSchema) },
      handler: async (_req, res) => {
        res.json(await listPeople(db));
      },
    },
    {
      method: 'get',
      path: '/people/directory',
      access: anyRole,
      summary: 'Names, e-mails and roles of active people, for choosing study members',
      responses: { 200: z.array(directoryEntrySchema) },
      handler: async (_req, res) => {
        const people = await listPeople(db, { enabledOnly: true });
        res.json(people.map(({ id, name, email, role }) => ({ id, name, email, role })));
      },
    },
    {
      method: 'post',
      path: '/people',
      access: admins,
      summary: 'Add a person with a role and a first password',
      request: { body: createPersonRequestSchema },
      responses: { 201: personSchema },
      handler: async (req, res) => {
        const body = parseInput(createPersonRequestSchema, req.body, 'person');
        res.status(201).json(await createPerson(db, req.user!, body));
      },
    },
    {
      method: 'get',
      path: '/people/:id',
      access: admins,
      summary: 'One person',
      request: { params: idParamsSchema },
      responses: { 200: personSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        res.json(await getPerson(db, id));
      },
    },
    {
      method: 'patch',
      path: '/people/:id',
      access: admins,
      summary: "Rename a person, change their role, or disable or enable their account",
      request: { params: idParamsSchema, body: updatePersonRequestSchema },
      responses: { 200: personSchema },
      handler: async (req, res) => {
        const { id } = parseInput(idParamsSchema, req.params, 'path');
        const body = parseInput(updatePersonRequestSchema, req.body, 'person change');
        res.json(await updatePerson(db, req.user!, id, body));
      },
    },
  ];
}
