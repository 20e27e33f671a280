import type { Knex } from 'knex';
import { z } from 'zod';
import { createPersonRequestSchema, idParamsSchema, personSchema, updatePersonRequestSchema } from '@tallyfit/contracts';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import { createPerson, getPerson, listPeople, updatePerson } from './people.service';

const directoryEntrySchema = personSchema.pick({ id: true, name: true, email: true, role: true });

export function peopleRoutes(db: Knex): RouteDefinition[] {
  return [
    defineRoute({
      method: 'get',
      path: '/people',
      access: 'people.manage',
      summary: 'Everyone who can sign in, including disabled accounts',
      responses: { 200: z.array(personSchema) },
      handler: () => listPeople(db),
    }),
    defineRoute({
      method: 'get',
      path: '/people/directory',
      access: 'people.directory',
      summary: 'Names, e-mails and roles of active people, for choosing study members',
      responses: { 200: z.array(directoryEntrySchema) },
      handler: async () => {
        const people = await listPeople(db, { enabledOnly: true });
        return people.map(({ id, name, email, role }) => ({ id, name, email, role }));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/people',
      access: 'people.manage',
      summary: 'Add a person with a role and a first password',
      request: { body: createPersonRequestSchema },
      responses: { 201: personSchema },
      handler: ({ body, user }) => createPerson(db, user, body),
    }),
    defineRoute({
      method: 'get',
      path: '/people/:id',
      access: 'people.manage',
      summary: 'One person',
      request: { params: idParamsSchema },
      responses: { 200: personSchema },
      handler: ({ params }) => getPerson(db, params.id),
    }),
    defineRoute({
      method: 'patch',
      path: '/people/:id',
      access: 'people.manage',
      summary: 'Rename a person, change their role, or disable or enable their account',
      request: { params: idParamsSchema, body: updatePersonRequestSchema },
      responses: { 200: personSchema },
      handler: ({ params, body, user }) => updatePerson(db, user, params.id, body),
    }),
  ];
}
