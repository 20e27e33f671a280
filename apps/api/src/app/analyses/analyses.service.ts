import type { Knex } from 'knex';
import { analyze, ENGINE_VERSION, type AnalysisResult } from '@tallyfit/engine';
import type { AnalysisRecord, AnalysisSummary, CreateAnalysisRequest, User } from '@tallyfit/contracts';
import { notFound } from '../http/http-error';

interface AnalysisRow {
  id: number;
  title: string;
  author_id: number;
  author_name: string;
  hypothesis_kind: string;
  n: number;
  k: number;
  p: number | null;
  spec_json: string;
  result_json: string;
  engine_version: string;
  created_at: string | Date;
}

/** The p-value a list shows and sorts by: Pearson's when it was run, else the first test's. */
function headlineP(result: AnalysisResult): number | null {
  const tests = result.tests as Record<string, { p: number } | undefined>;
  const first = tests['pearson'] ?? Object.values(tests).find((test) => test !== undefined);
  return first?.p ?? null;
}

const isoDate = (value: string | Date): string =>
  value instanceof Date ? value.toISOString() : new Date(value.replace(' ', 'T') + (value.endsWith('Z') ? '' : 'Z')).toISOString();

/** Runs the engine and stores spec, result and engine version together, in one transaction. */
export async function createAnalysis(db: Knex, author: User, request: CreateAnalysisRequest): Promise<AnalysisRecord> {
  const result = analyze(request.spec);
  const id = await db.transaction(async (trx) => {
    const [row] = await trx('analyses')
      .insert({
        title: request.title,
        author_id: author.id,
        hypothesis_kind: request.spec.hypothesis.kind,
        n: result.n,
        k: result.k,
        p: headlineP(result),
        spec_json: JSON.stringify(request.spec),
        result_json: JSON.stringify(result),
        engine_version: ENGINE_VERSION,
      })
      .returning('id');
    return typeof row === 'object' ? (row as { id: number }).id : (row as number);
  });
  return getAnalysis(db, id);
}

function selectWithAuthor(db: Knex) {
  return db<AnalysisRow>('analyses')
    .join('users', 'users.id', 'analyses.author_id')
    .select('analyses.*', 'users.name as author_name');
}

export async function getAnalysis(db: Knex, id: number): Promise<AnalysisRecord> {
  const row = await selectWithAuthor(db).where('analyses.id', id).first();
  if (!row) throw notFound(`analysis ${id} does not exist`);
  return {
    id: row.id,
    title: row.title,
    spec: JSON.parse(row.spec_json),
    result: JSON.parse(row.result_json),
    engineVersion: row.engine_version,
    author: { id: row.author_id, name: row.author_name },
    createdAt: isoDate(row.created_at),
  };
}

/** The caller's own analyses, newest first. */
export async function listOwnAnalyses(db: Knex, author: User, limit = 100): Promise<AnalysisSummary[]> {
  const rows = await selectWithAuthor(db)
    .where('analyses.author_id', author.id)
    .orderBy([
      { column: 'analyses.created_at', order: 'desc' },
      { column: 'analyses.id', order: 'desc' },
    ])
    .limit(limit);
  return rows.map((row) => ({
    id: row.id,
    title: row.title,
    hypothesisKind: row.hypothesis_kind,
    n: row.n,
    k: row.k,
    p: row.p,
    engineVersion: row.engine_version,
    author: { id: row.author_id, name: row.author_name },
    createdAt: isoDate(row.created_at),
  }));
}
