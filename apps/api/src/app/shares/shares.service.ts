import type { Knex } from 'knex';
import type { CreateShareRequest, Share, User } from '@tallyfit/contracts';
import { getReadableAnalysis } from '../analyses/analyses.service';
import { insertWithAudit } from '../audit/audit.service';
import type { Config } from '../config';
import { dbTime, isoDate } from '../http/db-time';
import { HttpError } from '../http/http-error';
import type { MailService } from '../mail/mail-service';
import { markdownReport } from '../reports/markdown-report';
import { analysisLink, downloadName, reportSourceFor } from '../reports/reports.service';
import { shareMailBody } from './share-mail';

interface ShareRow {
  id: number;
  analysis_id: number;
  sent_by: number;
  sender_name: string;
  recipients_json: string;
  message: string | null;
  status: 'sent' | 'failed';
  failure_reason: string | null;
  created_at: string | Date;
}

const toShare = (row: ShareRow): Share => ({
  id: row.id,
  analysisId: row.analysis_id,
  sentBy: { id: row.sent_by, name: row.sender_name },
  to: JSON.parse(row.recipients_json),
  message: row.message,
  status: row.status,
  failureReason: row.failure_reason,
  createdAt: isoDate(row.created_at),
});

/** E-mails one person may send from Tallyfit per hour: enough for a team, too few for a spam run (common practice, no source). */
export const SHARES_PER_HOUR = 20;
const HOUR_MS = 60 * 60 * 1000;

/**
 * Counts the person's shares of the last hour in the shares table (sent or failed: each was an
 * attempt to mail someone), so every server sharing the database applies one limit.
 */
async function requireShareAllowance(db: Knex, caller: User): Promise<void> {
  const since = dbTime(db, new Date(Date.now() - HOUR_MS).toISOString());
  const recent = await db('shares').where('sent_by', caller.id).andWhere('created_at', '>', since).orderBy('created_at', 'asc').select('created_at');
  if (recent.length < SHARES_PER_HOUR) return;
  const freesAt = new Date(isoDate(recent[recent.length - SHARES_PER_HOUR].created_at as string | Date)).getTime() + HOUR_MS;
  throw new HttpError(
    429,
    'too_many_shares',
    `you have shared ${SHARES_PER_HOUR} times in the last hour, the most allowed; try again in ${Math.max(1, Math.ceil((freesAt - Date.now()) / 60_000))} minutes`,
    undefined,
    { 'Retry-After': String(Math.max(1, Math.ceil((freesAt - Date.now()) / 1000))) },
  );
}

/**
 * Sends an analysis's report by e-mail and records the share with its audit event. When the mail
 * server does not take the message, nothing was sent: the share is recorded as failed with the
 * server's reason and the caller gets a 502 saying so.
 */
export async function shareAnalysis(
  db: Knex,
  config: Config,
  mail: MailService,
  caller: User,
  analysisId: number,
  request: CreateShareRequest,
): Promise<Share> {
  const source = await reportSourceFor(db, caller, analysisId);
  await requireShareAllowance(db, caller);
  const link = analysisLink(config, analysisId);
  const report = markdownReport(source, link);
  const recipients = [...new Set(request.to.map((address) => address.toLowerCase()))];
  let failureReason: string | null = null;
  try {
    await mail.send({
      to: recipients,
      subject: `Tallyfit analysis: ${source.title}`,
      ...shareMailBody(caller, source.title, link, report, request.message),
      replyTo: caller.email,
      attachments: [{ filename: downloadName(source, 'md'), content: report, contentType: 'text/markdown; charset=utf-8' }],
    });
  } catch (error) {
    failureReason = (error instanceof Error ? error.message : String(error)).slice(0, 500);
  }
  const share = {
    analysis_id: analysisId,
    sent_by: caller.id,
    recipients_json: JSON.stringify(recipients),
    message: request.message ?? null,
    status: failureReason ? 'failed' : 'sent',
    failure_reason: failureReason,
  };
  const id = await db.transaction((trx) =>
    insertWithAudit(trx, 'shares', share, (shareId) => ({
      actorId: caller.id,
      action: 'share',
      entityType: 'analysis',
      entityId: analysisId,
      studyId: source.studyId,
      summary: failureReason
        ? `tried to share analysis "${source.title}" with ${recipients.join(', ')}; the mail server did not take it`
        : `shared analysis "${source.title}" with ${recipients.join(', ')}`,
      after: { shareId, to: recipients, status: share.status, failureReason },
    })),
  );
  if (failureReason) {
    throw new HttpError(
      502,
      'mail_not_sent',
      `nothing was sent: the mail server (${mail.destination}) did not take the message: ${failureReason}. The share is recorded as failed (share ${id}).`,
    );
  }
  return getShare(db, id);
}

async function getShare(db: Knex, id: number): Promise<Share> {
  const row: ShareRow = await selectShares(db).where('shares.id', id).first();
  return toShare(row);
}

function selectShares(db: Knex) {
  return db('shares').join('users', 'users.id', 'shares.sent_by').select('shares.*', 'users.name as sender_name');
}

/** The shares of an analysis the caller may read, newest first. */
export async function listShares(db: Knex, caller: User, analysisId: number): Promise<Share[]> {
  await getReadableAnalysis(db, caller, analysisId);
  const rows: ShareRow[] = await selectShares(db)
    .where('shares.analysis_id', analysisId)
    .orderBy([
      { column: 'shares.created_at', order: 'desc' },
      { column: 'shares.id', order: 'desc' },
    ]);
  return rows.map(toShare);
}
