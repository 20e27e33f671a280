import type { Knex } from 'knex';
import { z } from 'zod';
import { createShareRequestSchema, idParamsSchema, outboxSchema, shareSchema, type Outbox } from '@tallyfit/contracts';
import type { Config } from '../config';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import type { MailService } from '../mail/mail-service';
import { listShares, shareAnalysis } from './shares.service';

export function sharesRoutes(db: Knex, config: Config, mail: MailService): RouteDefinition[] {
  return [
    defineRoute({
      method: 'post',
      path: '/analyses/:id/shares',
      access: 'analyses.share',
      summary: 'E-mail the analysis (a link and the Markdown report) to people; a mail failure is recorded and answered with 502',
      tag: 'shares',
      request: { params: idParamsSchema, body: createShareRequestSchema },
      responses: { 201: shareSchema },
      handler: ({ params, body, user }) => shareAnalysis(db, config, mail, user, params.id, body),
    }),
    defineRoute({
      method: 'get',
      path: '/analyses/:id/shares',
      access: 'analyses.read',
      summary: 'Who an analysis was shared with, by whom, and whether the mail went out',
      tag: 'shares',
      request: { params: idParamsSchema },
      responses: { 200: z.array(shareSchema) },
      handler: ({ params, user }) => listShares(db, user, params.id),
    }),
    defineRoute({
      method: 'get',
      path: '/outbox',
      access: 'outbox.read',
      summary: "What the built-in mail stand-in received, newest first (empty when mail goes to a real server)",
      tag: 'shares',
      responses: { 200: outboxSchema },
      handler: (): Outbox => {
        const messages = mail.outbox();
        return {
          available: messages !== undefined,
          destination: mail.destination,
          messages: (messages ?? []).map((message) => ({
            id: message.id,
            receivedAt: message.receivedAt,
            from: message.from,
            to: message.envelopeTo,
            subject: message.subject,
            text: message.text,
            html: message.html ?? null,
            attachments: message.attachments.map(({ fileName, contentType, sizeBytes }) => ({ fileName, contentType, sizeBytes })),
          })),
        };
      },
    }),
  ];
}
