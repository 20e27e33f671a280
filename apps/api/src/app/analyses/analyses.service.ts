import type { Knex } from 'knex';
import { ENGINE_VERSION, type AnalysisSpec } from '@tallyfit/engine';
import type { AnalysisChanges, AnalysisRecord, RerunAnalysisResponse, UpdateAnalysisRequest, User } from '@tallyfit/contracts';
import { insertWithAudit, recordAudit } from '../audit/audit.service';
import type { EngineRunner } from '../engine/engine-runner';
import { now } from '../http/db-time';
import { conflict, forbidden, notFound } from '../http/http-error';
import { requireStudyContributor } from '../studies/studies.service';
import { mayChangeAnalysis, scopeToReader } from './analysis-access';
import { compareRuns } from './analysis-changes';
import { resultColumns, selectAnalyses, toRecord } from './analysis-rows';

/** What a new analysis needs. A dataset-based analysis passes the spec built from the dataset and its id. */
export interface NewAnalysis {
  title: string;
  spec: AnalysisSpec;
  studyId?: number;
  notes?: string;
  datasetId?: number;
}

/** Any stored analysis by id, without an access check (for services that already checked). */
export async function getAnalysisById(db: Knex, id: number): Promise<AnalysisRecord> {
  const row = await selectAnalyses(db).select('analyses.*', 'users.name as author_name', 'studies.name as study_name').where('analyses.id', id).first();
  if (!row) throw notFound(`analysis ${id} does not exist`);
  return toRecord(row);
}

/** One analysis the caller may read; 404 otherwise, so the answer does not reveal what exists. */
export async function getReadableAnalysis(db: Knex, caller: User, id: number): Promise<AnalysisRecord> {
  const row = await selectAnalyses(db)
    .select('analyses.*', 'users.name as author_name', 'studies.name as study_name')
    .where('analyses.id', id)
    .modify((builder) => scopeToReader(builder, db, caller))
    .first();
  if (!row) throw notFound(`analysis ${id} does not exist`);
  return toRecord(row);
}

/**
 * Runs the engine (off the event loop when `engine` is the worker pool) and stores spec, result
 * and engine version with its audit event in one transaction.
 */
export async function createAnalysis(db: Knex, engine: EngineRunner, author: User, input: NewAnalysis): Promise<AnalysisRecord> {
  if (input.studyId !== undefined) await requireStudyContributor(db, author, input.studyId);
  const result = await engine.analyze(input.spec);
  const id = await db.transaction(async (trx) => {
    const newId = await insertWithAudit(
      trx,
      'analyses',
      {
        title: input.title,
        notes: input.notes ?? null,
        author_id: author.id,
        study_id: input.studyId ?? null,
        dataset_id: input.datasetId ?? null,
        status: 'draft',
        version: 1,
        is_latest: true,
        ...resultColumns(input.spec, result),
        updated_at: now(trx),
      },
      (newId) => ({
        actorId: author.id,
        action: 'create',
        entityType: 'analysis',
        entityId: newId,
        studyId: input.studyId ?? null,
        summary: `ran analysis "${input.title}"`,
        after: { title: input.title, studyId: input.studyId ?? null, datasetId: input.datasetId ?? null, p: result.conclusion.p },
      }),
    );
    // A first version starts its own series.
    await trx('analyses').where({ id: newId }).update({ series_id: newId });
    return newId;
  });
  return getAnalysisById(db, id);
}

async function requireChangeable(db: Knex, caller: User, id: number): Promise<AnalysisRecord> {
  const analysis = await getReadableAnalysis(db, caller, id);
  if (!(await mayChangeAnalysis(db, caller, analysis))) {
    throw forbidden('only its author, an admin or a contributor of its study may change this analysis');
  }
  return analysis;
}

/** Edits title and notes; the result stays as it was. */
export async function updateAnalysis(db: Knex, caller: User, id: number, request: UpdateAnalysisRequest): Promise<AnalysisRecord> {
  const before = await requireChangeable(db, caller, id);
  const changes: Record<string, unknown> = {};
  if (request.title !== undefined) changes['title'] = request.title;
  if (request.notes !== undefined) changes['notes'] = request.notes;
  await db.transaction(async (trx) => {
    await trx('analyses').where({ id }).update({ ...changes, updated_at: now(trx) });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'update',
      entityType: 'analysis',
      entityId: id,
      studyId: before.study?.id ?? null,
      summary: `edited analysis "${request.title ?? before.title}"`,
      before: { title: before.title, notes: before.notes },
      after: { title: request.title ?? before.title, notes: request.notes === undefined ? before.notes : request.notes },
    });
  });
  return getAnalysisById(db, id);
}

/**
 * Runs an analysis again (today's engine, the same or a changed spec) as a new version of the
 * same series; the earlier version stays, no longer the latest. Answers what changed.
 */
export async function rerunAnalysis(
  db: Knex,
  engine: EngineRunner,
  caller: User,
  id: number,
  spec?: AnalysisSpec,
): Promise<RerunAnalysisResponse> {
  const previous = await requireChangeable(db, caller, id);
  if (!previous.isLatest) throw conflict(`analysis ${id} has a newer version; re-run the latest one`);
  if (previous.study) await requireStudyContributor(db, caller, previous.study.id);
  const nextSpec = spec ?? previous.spec;
  // Same spec on the same engine would only store a duplicate version with the same figures.
  if (previous.engineVersion === ENGINE_VERSION && JSON.stringify(nextSpec) === JSON.stringify(previous.spec)) {
    throw conflict(`analysis ${id} was already run with the current engine (${ENGINE_VERSION}) and this spec; change the spec to run it again`);
  }
  const result = await engine.analyze(nextSpec);
  const newId = await db.transaction(async (trx) => {
    // Only one re-run of a version may win: the update claims the version, a racing one finds nothing to claim.
    const claimed = await trx('analyses').where({ id, is_latest: true }).update({ is_latest: false });
    if (claimed !== 1) throw conflict(`analysis ${id} was re-run meanwhile; re-run the latest one`);
    return insertWithAudit(
      trx,
      'analyses',
      {
        title: previous.title,
        notes: previous.notes,
        author_id: caller.id,
        study_id: previous.study?.id ?? null,
        dataset_id: previous.datasetId,
        status: 'draft',
        series_id: previous.seriesId,
        version: previous.version + 1,
        previous_id: previous.id,
        is_latest: true,
        ...resultColumns(nextSpec, result),
        updated_at: now(trx),
      },
      (inserted) => ({
        actorId: caller.id,
        action: 'create',
        entityType: 'analysis',
        entityId: inserted,
        studyId: previous.study?.id ?? null,
        summary: `re-ran analysis "${previous.title}" as version ${previous.version + 1}`,
        before: { id: previous.id, version: previous.version, engineVersion: previous.engineVersion, p: previous.result.conclusion.p },
        after: { id: inserted, version: previous.version + 1, engineVersion: result.engineVersion, p: result.conclusion.p },
      }),
    );
  });
  const analysis = await getAnalysisById(db, newId);
  return { analysis, changes: compareRuns(previous, { engineVersion: analysis.engineVersion, spec: nextSpec, result }) };
}

/**
 * What a version changed against the one it re-ran, recomputed from the two stored versions so it
 * reads the same after a reload; null for a first version.
 */
export async function changesSincePrevious(db: Knex, caller: User, id: number): Promise<AnalysisChanges | null> {
  const analysis = await getReadableAnalysis(db, caller, id);
  if (analysis.previousId === null) return null;
  const previous = await getAnalysisById(db, analysis.previousId);
  return compareRuns(previous, analysis);
}

/** Soft-deletes an analysis with all its versions; only its author or an admin may. The audit trail keeps it. */
export async function deleteAnalysis(db: Knex, caller: User, id: number): Promise<void> {
  const analysis = await getReadableAnalysis(db, caller, id);
  if (caller.role !== 'admin' && analysis.author.id !== caller.id) {
    throw forbidden('only its author or an admin may delete an analysis');
  }
  await db.transaction(async (trx) => {
    await trx('analyses')
      .where({ series_id: analysis.seriesId })
      .whereNull('deleted_at')
      .update({ deleted_at: now(trx), deleted_by: caller.id });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'delete',
      entityType: 'analysis',
      entityId: id,
      studyId: analysis.study?.id ?? null,
      summary: `deleted analysis "${analysis.title}" (all ${analysis.version} version${analysis.version === 1 ? '' : 's'})`,
      before: { title: analysis.title, status: analysis.status, seriesId: analysis.seriesId, p: analysis.result.conclusion.p },
    });
  });
}
