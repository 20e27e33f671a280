import type { Knex } from 'knex';
import type { AnalysisRecord, AnalysisStatus, Comment, Review, User } from '@tallyfit/contracts';
import { getAnalysisById, getReadableAnalysis } from '../analyses/analyses.service';
import { insertWithAudit, recordAudit } from '../audit/audit.service';
import { isoDate, now } from '../http/db-time';
import { conflict, forbidden } from '../http/http-error';
import { mailNotifications, notifyReviewDecision, type NotificationMail } from '../notifications/notifications.service';

type Decision = Review['decision'];

/**
 * The review path: draft → in review → signed off | returned; a returned analysis can be resubmitted,
 * and its author may withdraw a submission back to draft while it waits.
 */
const TRANSITIONS: Record<Decision, { from: readonly AnalysisStatus[]; to: AnalysisStatus; verb: string }> = {
  submitted: { from: ['draft', 'returned'], to: 'in_review', verb: 'submitted for review' },
  signed_off: { from: ['in_review'], to: 'signed_off', verb: 'signed off' },
  returned: { from: ['in_review'], to: 'returned', verb: 'returned' },
  withdrawn: { from: ['in_review'], to: 'draft', verb: 'withdrawn from review' },
};

/** The decisions people are told about: withdrawing is the author's own business. */
const NOTIFIED: Partial<Record<Decision, Exclude<Decision, 'withdrawn'>>> = {
  submitted: 'submitted',
  signed_off: 'signed_off',
  returned: 'returned',
};

const STATUS_WORDS: Record<AnalysisStatus, string> = {
  draft: 'a draft',
  in_review: 'in review',
  signed_off: 'signed off',
  returned: 'returned',
};

/**
 * Who may decide is the route's capability; authorship decides the rest: only the author (or an
 * admin) submits, and nobody, admins included, signs off or returns their own analysis, since a
 * review is a second person's judgement.
 */
function checkReviewer(caller: User, analysis: AnalysisRecord, decision: Decision): void {
  if (decision === 'submitted' && analysis.author.id !== caller.id && caller.role !== 'admin') {
    throw forbidden('only the author of an analysis (or an admin) may submit it for review');
  }
  if (decision === 'withdrawn' && analysis.author.id !== caller.id) {
    throw forbidden('only the author of an analysis may withdraw its submission');
  }
  if ((decision === 'signed_off' || decision === 'returned') && analysis.author.id === caller.id) {
    throw forbidden(`you wrote this analysis, so you cannot ${decision === 'signed_off' ? 'sign it off' : 'return it'}: a review needs a second person; ask another lead or an admin`);
  }
}

/**
 * Records a review decision and moves the analysis's status, in one transaction with its audit event
 * and the notifications it causes; their e-mail copies go out after the commit (when `delivery` is
 * given), so a mail failure never undoes the decision.
 */
export async function decideReview(
  db: Knex,
  caller: User,
  analysisId: number,
  decision: Decision,
  comment?: string,
  delivery?: NotificationMail,
): Promise<AnalysisRecord> {
  const analysis = await getReadableAnalysis(db, caller, analysisId);
  checkReviewer(caller, analysis, decision);
  const transition = TRANSITIONS[decision];
  if (!analysis.isLatest) throw conflict(`analysis ${analysisId} has a newer version; review the latest one`);
  if (!transition.from.includes(analysis.status)) {
    throw conflict(`analysis ${analysisId} is ${STATUS_WORDS[analysis.status]}, so it cannot be ${transition.verb}`);
  }
  const notificationIds = await db.transaction(async (trx) => {
    // The status in the WHERE makes two racing decisions safe: only one finds the row still in its old status.
    const moved = await trx('analyses')
      .where({ id: analysisId, status: analysis.status })
      .update({ status: transition.to, updated_at: now(trx) });
    if (moved !== 1) throw conflict(`analysis ${analysisId} changed status meanwhile; reload it`);
    await trx('analysis_reviews').insert({ analysis_id: analysisId, actor_id: caller.id, decision, comment: comment ?? null });
    const kind = NOTIFIED[decision];
    const notified = kind
      ? await notifyReviewDecision(trx, {
          kind,
          analysis: { id: analysisId, title: analysis.title, authorId: analysis.author.id },
          actor: { id: caller.id, name: caller.name },
          note: comment ?? null,
        })
      : [];
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'review',
      entityType: 'analysis',
      entityId: analysisId,
      studyId: analysis.study?.id ?? null,
      summary: `${transition.verb} analysis "${analysis.title}"`,
      before: { status: analysis.status },
      after: { status: transition.to, comment: comment ?? null, notified: notified.length },
    });
    return notified;
  });
  if (delivery) {
    // After the commit, so a mail failure never undoes the decision; awaited so nothing writes after
    // the answer (the mail client's own time-out bounds the wait). Each outcome is recorded per notification.
    await mailNotifications(db, delivery, notificationIds).catch((error: unknown) =>
      delivery.logger.warn({ analysisId, reason: String(error) }, 'notification e-mails not sent'),
    );
  }
  return getAnalysisById(db, analysisId);
}

export async function listReviews(db: Knex, caller: User, analysisId: number): Promise<Review[]> {
  await getReadableAnalysis(db, caller, analysisId);
  const rows = await db('analysis_reviews')
    .join('users', 'users.id', 'analysis_reviews.actor_id')
    .where('analysis_reviews.analysis_id', analysisId)
    .select('analysis_reviews.*', 'users.name as actor_name')
    .orderBy([{ column: 'analysis_reviews.created_at' }, { column: 'analysis_reviews.id' }]);
  return rows.map((row) => ({
    id: row.id,
    analysisId: row.analysis_id,
    decision: row.decision,
    comment: row.comment,
    by: { id: row.actor_id, name: row.actor_name },
    createdAt: isoDate(row.created_at),
  }));
}

const toComment = (row: { id: number; analysis_id: number; body: string; author_id: number; author_name: string; created_at: string | Date }): Comment => ({
  id: row.id,
  analysisId: row.analysis_id,
  body: row.body,
  author: { id: row.author_id, name: row.author_name },
  createdAt: isoDate(row.created_at),
});

function selectComments(db: Knex) {
  return db('analysis_comments')
    .join('users', 'users.id', 'analysis_comments.author_id')
    .select('analysis_comments.*', 'users.name as author_name');
}

export async function listComments(db: Knex, caller: User, analysisId: number): Promise<Comment[]> {
  await getReadableAnalysis(db, caller, analysisId);
  const rows = await selectComments(db)
    .where('analysis_comments.analysis_id', analysisId)
    .orderBy([{ column: 'analysis_comments.created_at' }, { column: 'analysis_comments.id' }]);
  return rows.map(toComment);
}

/** Anyone who can read an analysis may comment on it. */
export async function addComment(db: Knex, caller: User, analysisId: number, body: string): Promise<Comment> {
  const analysis = await getReadableAnalysis(db, caller, analysisId);
  const id = await db.transaction((trx) =>
    insertWithAudit(trx, 'analysis_comments', { analysis_id: analysisId, author_id: caller.id, body }, (commentId) => ({
      actorId: caller.id,
      action: 'create',
      entityType: 'comment',
      entityId: commentId,
      studyId: analysis.study?.id ?? null,
      summary: `commented on analysis "${analysis.title}"`,
      after: { analysisId, body: body.slice(0, 200) },
    })),
  );
  return toComment(await selectComments(db).where('analysis_comments.id', id).first());
}
