import type { Knex } from 'knex';
import type { AnalysisSummary, ListAnalysesFilters, Page, User } from '@tallyfit/contracts';
import { dbTime } from '../http/db-time';
import { scopeToReader } from './analysis-access';
import { selectAnalyses, SUMMARY_COLUMNS, toSummary, type AnalysisRow } from './analysis-rows';
import { getReadableAnalysis } from './analyses.service';

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
