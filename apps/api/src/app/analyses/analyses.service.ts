import type { Knex } from 'knex';
import { ENGINE_VERSION, type AnalysisResult, type AnalysisSpec, type SegmentsInput } from '@tallyfit/engine';
import type { AnalysisChanges, AnalysisRecord, RerunAnalysisResponse, UpdateAnalysisRequest, User } from '@tallyfit/contracts';
import { insertWithAudit, recordAudit } from '../audit/audit.service';
import type { EngineRunner, EngineRunOptions } from '../engine/engine-runner';
import { now } from '../http/db-time';
import { conflict, forbidden, notFound } from '../http/http-error';
import { requireStudyContributor } from '../studies/studies.service';
import { mayChangeAnalysis, scopeToReader } from './analysis-access';
import { compareRuns } from './analysis-changes';
import { resultColumns, segmentColumns, selectAnalyses, toRecord, type StoredSegments } from './analysis-rows';

/** What a new analysis needs. A dataset-based analysis passes the spec built from the dataset and its id. */
export interface NewAnalysis {
  title: string;
  spec: AnalysisSpec;
  studyId?: number;
  notes?: string;
  datasetId?: number;
  /** a dataset-based analysis split by a second column: the column and the engine's segments input */
  segments?: { column: string; input: SegmentsInput };
}

/** The segments of a run: the stored column and counts tested against the run's spec (without its observed counts). */
async function runSegments(
  engine: EngineRunner,
  spec: AnalysisSpec,
  segments: { column: string; input: SegmentsInput } | undefined,
  run: EngineRunOptions,
): Promise<StoredSegments | null> {
  if (!segments) return null;
  const { observed: _observed, ...shared } = spec;
  const input = { ...segments.input, spec: shared };
  return { column: segments.column, input, result: await engine.analyzeSegments(input, run) };
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
  const owner = { owner: String(author.id) };
  const result = await engine.analyze(input.spec, owner);
  const segments = await runSegments(engine, input.spec, input.segments, owner);
  const id = await db.transaction((trx) => storeAnalysis(trx, author, input, result, segments));
  return getAnalysisById(db, id);
}

/**
 * Stores an analysis the engine has already run, with its audit event, inside the caller's
 * transaction (so a watch's batch and its analysis are stored together or not at all). The caller
 * has checked that the author may add work to the study. Answers the new analysis's id.
 */
export async function storeAnalysis(
  trx: Knex.Transaction,
  author: Pick<User, 'id'>,
  input: NewAnalysis,
  result: AnalysisResult,
  segments: StoredSegments | null = null,
): Promise<number> {
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
      ...segmentColumns(segments),
      updated_at: now(trx),
    },
    (id) => ({
      actorId: author.id,
      action: 'create',
      entityType: 'analysis',
      entityId: id,
      studyId: input.studyId ?? null,
      summary: `ran analysis "${input.title}"`,
      after: {
        title: input.title,
        studyId: input.studyId ?? null,
        datasetId: input.datasetId ?? null,
        p: result.conclusion.p,
        ...(segments ? { segmentColumn: segments.column, segments: segments.result.rows.length, segmentsDeparting: segments.result.significantCount } : {}),
      },
    }),
  );
  // A first version starts its own series.
  await trx('analyses').where({ id: newId }).update({ series_id: newId });
  return newId;
}

async function requireChangeable(db: Knex, caller: User, id: number): Promise<AnalysisRecord> {
  const analysis = await getReadableAnalysis(db, caller, id);
  if (!(await mayChangeAnalysis(db, caller, analysis))) {
    throw forbidden('only its author, an admin or a contributor of its study may change this analysis');
  }
  return analysis;
}

/**
 * A signed-off analysis is the record a reviewer vouched for: it stays as it was signed. Changes
 * go into a new version (a re-run), which starts as a draft and needs its own review.
 */
function requireNotSignedOff(analysis: AnalysisRecord, what: string): void {
  if (analysis.status === 'signed_off') {
    throw conflict(`analysis ${analysis.id} is signed off, so it cannot be ${what}; re-run it to make a new version, which needs its own review`);
  }
}

/** Edits title and notes; the result stays as it was. Signed-off analyses are frozen. */
export async function updateAnalysis(db: Knex, caller: User, id: number, request: UpdateAnalysisRequest): Promise<AnalysisRecord> {
  const before = await requireChangeable(db, caller, id);
  requireNotSignedOff(before, 'edited');
  const changes: Record<string, unknown> = {};
  if (request.title !== undefined) changes['title'] = request.title;
  if (request.notes !== undefined) changes['notes'] = request.notes;
  await db.transaction(async (trx) => {
    // Guarded by the status, so a sign-off racing this edit cannot be followed by the edit.
    const edited = await trx('analyses').where({ id }).whereNot({ status: 'signed_off' }).update({ ...changes, updated_at: now(trx) });
    if (edited !== 1) throw conflict(`analysis ${id} was signed off meanwhile, so it cannot be edited; re-run it to make a new version`);
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
  const owner = { owner: String(caller.id) };
  const result = await engine.analyze(nextSpec, owner);
  // A split analysis is re-run with the same segments' counts.
  const stored = await db('analyses').where({ id }).first('segments_json');
  const storedSegments = stored?.segments_json ? (JSON.parse(stored.segments_json) as StoredSegments) : undefined;
  const segments = await runSegments(engine, nextSpec, storedSegments, owner);
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
        ...segmentColumns(segments),
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

/**
 * Soft-deletes an analysis with all its versions; only its author or an admin may, and when any
 * version was signed off, only an admin (a signed-off record does not vanish at its author's
 * wish). The audit event counts the versions actually deleted. The audit trail keeps it all.
 */
export async function deleteAnalysis(db: Knex, caller: User, id: number): Promise<void> {
  const analysis = await getReadableAnalysis(db, caller, id);
  if (caller.role !== 'admin' && analysis.author.id !== caller.id) {
    throw forbidden('only its author or an admin may delete an analysis');
  }
  await db.transaction(async (trx) => {
    const series = trx('analyses').where({ series_id: analysis.seriesId }).whereNull('deleted_at');
    const signedOff = await series.clone().where({ status: 'signed_off' }).orderBy('version').pluck('version');
    if (signedOff.length && caller.role !== 'admin') {
      throw conflict(
        `analysis ${id} has a signed-off version (version ${signedOff.join(', ')}), so only an admin may delete it; ask an admin, who will be named in the audit trail`,
      );
    }
    const deleted = await series.clone().update({ deleted_at: now(trx), deleted_by: caller.id });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'delete',
      entityType: 'analysis',
      entityId: id,
      studyId: analysis.study?.id ?? null,
      summary: `deleted analysis "${analysis.title}" (all ${deleted} version${deleted === 1 ? '' : 's'}${signedOff.length ? `, signed off: version ${signedOff.join(', ')}` : ''})`,
      before: {
        title: analysis.title,
        status: analysis.status,
        seriesId: analysis.seriesId,
        versions: deleted,
        signedOffVersions: signedOff,
        p: analysis.result.conclusion.p,
      },
    });
  });
}
