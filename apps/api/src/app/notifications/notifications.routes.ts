import type { Knex } from 'knex';
import { z } from 'zod';
import { idParamsSchema, listNotificationsQuerySchema, notificationSchema, notificationsPageSchema } from '@tallyfit/contracts';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import { listNotifications, markAllNotificationsRead, markNotificationRead } from './notifications.service';

export function notificationsRoutes(db: Knex): RouteDefinition[] {
  return [
    defineRoute({
      method: 'get',
      path: '/notifications',
      access: 'account.use',
      summary: "The caller's notifications of review decisions, newest first, paged, with the unread count",
      tag: 'notifications',
      request: { query: listNotificationsQuerySchema },
      responses: { 200: notificationsPageSchema },
      handler: async ({ query, user, res }) => {
        res.json(await listNotifications(db, user, query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/notifications/read-all',
      access: 'account.use',
      summary: "Mark every one of the caller's notifications read",
      tag: 'notifications',
      responses: { 200: z.object({ marked: z.number().int() }) },
      handler: async ({ user, res }) => {
        res.json(await markAllNotificationsRead(db, user));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/notifications/:id/read',
      access: 'account.use',
      summary: 'Mark one of the caller’s notifications read',
      tag: 'notifications',
      request: { params: idParamsSchema },
      responses: { 200: notificationSchema },
      handler: async ({ params, user, res }) => {
        res.json(await markNotificationRead(db, user, params.id));
      },
    }),
  ];
}
