import type { Knex } from 'knex';
import { ENGINE_VERSION, type AnalysisResult, type AnalysisSpec, type SegmentsInput, type SegmentsResult } from '@tallyfit/engine';
import type {
  AnalysisRecord,
  AnalysisStatus,
  AnalysisSummary,
  ListAnalysesFilters,
  Page,
  RerunAnalysisResponse,
  UpdateAnalysisRequest,
  User,
} from '@tallyfit/contracts';
import { recordAudit } from '../audit/audit.service';
import type { EngineRunner } from '../engine/engine-runner';
import { dbTime, insertedId, isoDate, now } from '../http/db-time';
import { conflict, forbidden, notFound } from '../http/http-error';
import { requireStudyContributor } from '../studies/studies.service';
import { mayChangeAnalysis, scopeToReader } from './analysis-access';
import { compareRuns } from './analysis-changes';

export interface AnalysisRow {
  id: number;
  title: string;
  notes: string | null;
  author_id: number;
  author_name: string;
  study_id: number | null;
  study_name: string | null;
  dataset_id: number | null;
  status: AnalysisStatus;
  hypothesis_kind: string;
  n: number;
  k: number;
  p: number | null;
  alpha: number;
  significant: number | boolean | null;
  tests_run: string;
  spec_json: string;
  result_json: string;
  engine_version: string;
  series_id: number | null;
  version: number;
  previous_id: number | null;
  is_latest: number | boolean;
  segment_column: string | null;
  segments_json?: string | null;
  created_at: string | Date;
  updated_at: string | Date | null;
}

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

/** Test names as the spec spells them, stored comma-wrapped so one LIKE finds one test. */
const SPEC_TEST_NAMES: Record<string, string> = { pearson: 'pearson', g: 'g', exact: 'exact', cressieRead: 'cressie-read' };
const testsRunColumn = (result: AnalysisResult) =>
  ',' + Object.keys(result.tests).map((name) => SPEC_TEST_NAMES[name] ?? name).join(',') + ',';

/** The columns derived from a result, so lists can filter and sort without reading result_json. */
function resultColumns(spec: AnalysisSpec, result: AnalysisResult) {
  return {
    hypothesis_kind: spec.hypothesis.kind,
    n: result.n,
    k: result.k,
    p: result.conclusion.p,
    alpha: result.conclusion.alpha,
    significant: result.conclusion.significant,
    tests_run: testsRunColumn(result),
    spec_json: JSON.stringify(spec),
    result_json: JSON.stringify(result),
    engine_version: result.engineVersion ?? ENGINE_VERSION,
  };
}

function selectAnalyses(db: Knex) {
  return db('analyses')
    .join('users', 'users.id', 'analyses.author_id')
    .leftJoin('studies', 'studies.id', 'analyses.study_id')
    .whereNull('analyses.deleted_at');
}

const SUMMARY_COLUMNS = [
  'analyses.id', 'analyses.title', 'analyses.notes', 'analyses.author_id', 'analyses.study_id', 'analyses.dataset_id',
  'analyses.status', 'analyses.hypothesis_kind', 'analyses.n', 'analyses.k', 'analyses.p', 'analyses.alpha',
  'analyses.significant', 'analyses.tests_run', 'analyses.engine_version', 'analyses.series_id', 'analyses.version',
  'analyses.previous_id', 'analyses.is_latest', 'analyses.segment_column', 'analyses.created_at', 'analyses.updated_at',
  'users.name as author_name', 'studies.name as study_name',
];

function commonFields(row: AnalysisRow) {
  return {
    id: row.id,
    title: row.title,
    notes: row.notes,
    engineVersion: row.engine_version,
    author: { id: row.author_id, name: row.author_name },
    study: row.study_id === null ? null : { id: row.study_id, name: row.study_name ?? '' },
    datasetId: row.dataset_id,
    status: row.status,
    version: row.version,
    seriesId: row.series_id ?? row.id,
    previousId: row.previous_id,
    isLatest: Boolean(row.is_latest),
    segmentColumn: row.segment_column ?? null,
    createdAt: isoDate(row.created_at),
    updatedAt: isoDate(row.updated_at ?? row.created_at),
  };
}

const toSummary = (row: AnalysisRow): AnalysisSummary => ({
  ...commonFields(row),
  hypothesisKind: row.hypothesis_kind,
  n: row.n,
  k: row.k,
  p: row.p,
  alpha: row.alpha,
  significant: row.significant === null ? null : Boolean(row.significant),
  tests: row.tests_run.split(',').filter(Boolean),
});

const toRecord = (row: AnalysisRow): AnalysisRecord => ({
  ...commonFields(row),
  spec: JSON.parse(row.spec_json),
  result: JSON.parse(row.result_json),
  segments: row.segments_json ? (JSON.parse(row.segments_json) as StoredSegments).result : null,
});

/** What segments_json holds: the engine's input (so a re-run can test the same segments again) and its result. */
interface StoredSegments {
  column: string;
  input: SegmentsInput;
  result: SegmentsResult;
}

/** The segments of a new run: the stored column and counts tested against the run's spec. */
async function runSegments(engine: EngineRunner, spec: AnalysisSpec, segments: { column: string; input: SegmentsInput } | undefined) {
  if (!segments) return null;
  const { observed: _observed, ...shared } = spec;
  const input = { ...segments.input, spec: shared };
  return { column: segments.column, input, result: await engine.analyzeSegments(input) } satisfies StoredSegments;
}

const segmentColumns = (segments: StoredSegments | null) => ({
  segment_column: segments?.column ?? null,
  segments_json: segments ? JSON.stringify(segments) : null,
});

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
  const segments = await runSegments(engine, input.spec, input.segments);
  const id = await db.transaction(async (trx) => {
    const [row] = await trx('analyses')
      .insert({
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
      })
      .returning('id');
    const newId = insertedId(row);
    await trx('analyses').where({ id: newId }).update({ series_id: newId });
    await recordAudit(trx, {
      actorId: author.id,
      action: 'create',
      entityType: 'analysis',
      entityId: newId,
      studyId: input.studyId ?? null,
      summary: `ran analysis "${input.title}"`,
      after: {
        title: input.title,
        studyId: input.studyId ?? null,
        datasetId: input.datasetId ?? null,
        p: result.conclusion.p,
        ...(segments ? { segmentColumn: segments.column, segments: segments.result.rows.length, segmentsSignificant: segments.result.significantCount } : {}),
      },
    });
    return newId;
  });
  return getAnalysisById(db, id);
}

const SORT_COLUMNS: Record<string, string> = {
  date: 'analyses.created_at',
  study: 'studies.name',
  author: 'users.name',
  p: 'analyses.p',
  status: 'analyses.status',
};

const NULLABLE_SORTS = new Set(['study', 'p']);

/**
 * The history: one page of the analyses the caller may read, sorted and filtered. Two steps: the
 * count and the page's ids come from the analyses table's listing index alone (the wide rows with
 * their JSON are never scanned, except for free text), then only that page's rows are read.
 */
export async function listAnalyses(db: Knex, caller: User, query: ListAnalysesFilters): Promise<Page<AnalysisSummary>> {
  const filtered = db('analyses')
    .whereNull('analyses.deleted_at')
    .modify((builder) => scopeToReader(builder, db, caller))
    .modify((builder) => {
      if (!query.allVersions) builder.where('analyses.is_latest', true);
      if (query.studyId) builder.where('analyses.study_id', query.studyId);
      if (query.author) builder.where('analyses.author_id', query.author === 'me' ? caller.id : Number(query.author));
      if (query.test) builder.where('analyses.tests_run', 'like', `%,${query.test},%`);
      if (query.status) builder.where('analyses.status', query.status);
      if (query.from) builder.where('analyses.created_at', '>=', dbTime(db, query.from));
      if (query.to) builder.where('analyses.created_at', '<=', dbTime(db, query.to));
      if (query.significant !== undefined) builder.where('analyses.significant', query.significant);
      if (query.q) {
        const pattern = `%${query.q.toLowerCase().replace(/[\\%_]/g, (c) => '\\' + c)}%`;
        builder.where((inner) =>
          inner
            .whereRaw("lower(analyses.title) like ? escape '\\'", [pattern])
            .orWhereRaw("lower(coalesce(analyses.notes, '')) like ? escape '\\'", [pattern]),
        );
      }
    });
  const [{ total }] = await filtered.clone().count({ total: '*' });
  const ids: number[] = await filtered
    .clone()
    .modify((builder) => {
      if (query.sort === 'study') builder.leftJoin('studies', 'studies.id', 'analyses.study_id');
      if (query.sort === 'author') builder.join('users', 'users.id', 'analyses.author_id');
      const column = SORT_COLUMNS[query.sort];
      // Rows without a study or a p-value go last either way. (Written out because knex drops the
      // column when asked for nulls-last on SQLite.) Date, author and status are never null, which
      // keeps the default sort free to walk the listing index.
      if (NULLABLE_SORTS.has(query.sort)) builder.orderByRaw('(?? is null)', [column]);
      builder.orderBy(column, query.order).orderBy('analyses.id', query.order);
    })
    .limit(query.pageSize)
    .offset((query.page - 1) * query.pageSize)
    .pluck('analyses.id');
  const rows: AnalysisRow[] = ids.length ? await selectAnalyses(db).select(SUMMARY_COLUMNS).whereIn('analyses.id', ids) : [];
  const byId = new Map(rows.map((row) => [row.id, row]));
  const items = ids.map((id) => byId.get(id)).filter((row): row is AnalysisRow => row !== undefined);
  return { items: items.map(toSummary), total: Number(total), page: query.page, pageSize: query.pageSize };
}

/** Every version of an analysis's series, oldest first. */
export async function listVersions(db: Knex, caller: User, id: number): Promise<AnalysisSummary[]> {
  const analysis = await getReadableAnalysis(db, caller, id);
  const rows: AnalysisRow[] = await selectAnalyses(db)
    .select(SUMMARY_COLUMNS)
    .where('analyses.series_id', analysis.seriesId)
    .orderBy('analyses.version');
  return rows.map(toSummary);
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
  const result = await engine.analyze(nextSpec);
  const stored = await db('analyses').where({ id }).first('segments_json');
  const segments = await runSegments(engine, nextSpec, stored?.segments_json ? (JSON.parse(stored.segments_json) as StoredSegments) : undefined);
  const newId = await db.transaction(async (trx) => {
    // Only one re-run of a version may win: the update claims the version, a racing one finds nothing to claim.
    const claimed = await trx('analyses').where({ id, is_latest: true }).update({ is_latest: false });
    if (claimed !== 1) throw conflict(`analysis ${id} was re-run meanwhile; re-run the latest one`);
    const [row] = await trx('analyses')
      .insert({
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
      })
      .returning('id');
    const inserted = insertedId(row);
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'create',
      entityType: 'analysis',
      entityId: inserted,
      studyId: previous.study?.id ?? null,
      summary: `re-ran analysis "${previous.title}" as version ${previous.version + 1}`,
      before: { id: previous.id, version: previous.version, engineVersion: previous.engineVersion, p: previous.result.conclusion.p },
      after: { id: inserted, version: previous.version + 1, engineVersion: result.engineVersion, p: result.conclusion.p },
    });
    return inserted;
  });
  const analysis = await getAnalysisById(db, newId);
  return { analysis, changes: compareRuns(previous, { engineVersion: analysis.engineVersion, spec: nextSpec, result }) };
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
