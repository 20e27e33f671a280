import type { Knex } from 'knex';
import { ENGINE_VERSION, upgradeStoredResult, type AnalysisResult, type AnalysisSpec } from '@tallyfit/engine';
import type { AnalysisRecord, AnalysisStatus, AnalysisSummary } from '@tallyfit/contracts';
import { isoDate } from '../http/db-time';

/** How an analysis is stored: one row per version, its spec and result as JSON beside the columns lists filter on. */
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
  created_at: string | Date;
  updated_at: string | Date | null;
}

/** The tests that ran, by their spec names (the result's keys), stored comma-wrapped so one LIKE finds one test. */
const testsRunColumn = (result: AnalysisResult) => ',' + Object.keys(result.tests).join(',') + ',';

/** The columns derived from a result, so lists can filter and sort without reading result_json. */
export function resultColumns(spec: AnalysisSpec, result: AnalysisResult) {
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

export function selectAnalyses(db: Knex) {
  return db('analyses')
    .join('users', 'users.id', 'analyses.author_id')
    .leftJoin('studies', 'studies.id', 'analyses.study_id')
    .whereNull('analyses.deleted_at');
}

export const SUMMARY_COLUMNS = [
  'analyses.id', 'analyses.title', 'analyses.notes', 'analyses.author_id', 'analyses.study_id', 'analyses.dataset_id',
  'analyses.status', 'analyses.hypothesis_kind', 'analyses.n', 'analyses.k', 'analyses.p', 'analyses.alpha',
  'analyses.significant', 'analyses.tests_run', 'analyses.engine_version', 'analyses.series_id', 'analyses.version',
  'analyses.previous_id', 'analyses.is_latest', 'analyses.created_at', 'analyses.updated_at',
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
    createdAt: isoDate(row.created_at),
    updatedAt: isoDate(row.updated_at ?? row.created_at),
  };
}

export const toSummary = (row: AnalysisRow): AnalysisSummary => ({
  ...commonFields(row),
  hypothesisKind: row.hypothesis_kind,
  n: row.n,
  k: row.k,
  p: row.p,
  alpha: row.alpha,
  significant: row.significant === null ? null : Boolean(row.significant),
  tests: row.tests_run.split(',').filter(Boolean),
});

export const toRecord = (row: AnalysisRow): AnalysisRecord => ({
  ...commonFields(row),
  spec: JSON.parse(row.spec_json),
  // Results stored by engine 0.1.x keyed the Cressie–Read test `cressieRead`; read them in today's form.
  result: upgradeStoredResult(JSON.parse(row.result_json)),
});
