import { chmodSync, mkdirSync, renameSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import type { Knex } from 'knex';
import type { CategoryCounts, CountSelection, DatasetRecord, DatasetSummary, User } from '@tallyfit/contracts';
import { recordAudit } from '../audit/audit.service';
import { insertedId, isoDate, now } from '../http/db-time';
import { forbidden, notFound, unprocessable } from '../http/http-error';
import { getStudy, requireStudyContributor } from '../studies/studies.service';
import { memberStudyIds, readsEveryStudy } from '../studies/study-access';
import { DatasetFormatError } from './dataset-format-error';
import { countCategories, scanTable } from './dataset-scan';
import { sha256OfFile } from './file-checksum';
import type { FileKind } from './file-kind';

interface DatasetRow {
  id: number;
  study_id: number;
  uploaded_by: number;
  uploader_name: string;
  file_name: string;
  kind: FileKind;
  size_bytes: number | string;
  sha256: string;
  row_count: number | string;
  columns_json: string;
  preview_json: string;
  offered_json: string;
  selected_json: string | null;
  stored_file: string | null;
  created_at: string | Date;
}

export interface ReceivedFile {
  /** where multer wrote it */
  path: string;
  originalName: string;
  sizeBytes: number;
  kind: FileKind;
}

/** Where stored dataset files live, relative to the data folder. */
const STORE = 'datasets';

/** A file that cannot be read becomes a 422 naming the place and the problem. */
export function asUnprocessable(error: unknown): unknown {
  if (!(error instanceof DatasetFormatError)) return error;
  return unprocessable(`the file cannot be used: ${error.message}`, [{ path: 'file', message: error.message }]);
}

const toSummary = (row: DatasetRow): DatasetSummary => ({
  id: row.id,
  studyId: row.study_id,
  fileName: row.file_name,
  kind: row.kind,
  sizeBytes: Number(row.size_bytes),
  sha256: row.sha256,
  rowCount: Number(row.row_count),
  columnNames: (JSON.parse(row.columns_json) as Array<{ name: string }>).map((column) => column.name),
  uploadedBy: { id: row.uploaded_by, name: row.uploader_name },
  createdAt: isoDate(row.created_at),
});

const toRecord = (row: DatasetRow): DatasetRecord => ({
  ...toSummary(row),
  columns: JSON.parse(row.columns_json),
  preview: JSON.parse(row.preview_json),
  offeredCounts: JSON.parse(row.offered_json),
  selectedCounts: row.selected_json === null ? null : JSON.parse(row.selected_json),
});

function selectDatasets(db: Knex) {
  return db('datasets')
    .join('users', 'users.id', 'datasets.uploaded_by')
    .select('datasets.*', 'users.name as uploader_name')
    .whereNull('datasets.deleted_at');
}

/**
 * Reads an uploaded file once (streaming), then stores its summary, its audit event and the file
 * itself together: when the file cannot be read, or anything fails, nothing is stored and the
 * temporary file is removed.
 */
export async function createDataset(
  db: Knex,
  dataDir: string,
  caller: User,
  studyId: number,
  file: ReceivedFile,
  selection?: CountSelection,
): Promise<DatasetRecord> {
  let storedPath: string | undefined;
  try {
    await requireStudyContributor(db, caller, studyId);
    const [scan, sha256] = await Promise.all([scanTable(file.path, file.kind, selection), sha256OfFile(file.path)]).catch((error: unknown) => {
      throw asUnprocessable(error);
    });
    const id = await db.transaction(async (trx) => {
      const [row] = await trx('datasets')
        .insert({
          study_id: studyId,
          uploaded_by: caller.id,
          file_name: file.originalName.slice(0, 255),
          kind: file.kind,
          size_bytes: file.sizeBytes,
          sha256,
          row_count: scan.rowCount,
          columns_json: JSON.stringify(scan.columns),
          preview_json: JSON.stringify(scan.preview),
          offered_json: JSON.stringify(scan.offeredCounts),
          selected_json: scan.selectedCounts ? JSON.stringify(scan.selectedCounts) : null,
        })
        .returning('id');
      const newId = insertedId(row);
      const storedFile = `${STORE}/${newId}-${sha256.slice(0, 12)}.${file.kind}`;
      await trx('datasets').where({ id: newId }).update({ stored_file: storedFile });
      await recordAudit(trx, {
        actorId: caller.id,
        action: 'create',
        entityType: 'dataset',
        entityId: newId,
        studyId,
        summary: `uploaded dataset "${file.originalName}" (${scan.rowCount} rows)`,
        after: { fileName: file.originalName, sizeBytes: file.sizeBytes, sha256, rowCount: scan.rowCount, selection: selection ?? null },
      });
      // Last step inside the transaction: if the move fails, the rows roll back.
      mkdirSync(join(dataDir, STORE), { recursive: true, mode: 0o700 });
      storedPath = join(dataDir, storedFile);
      renameSync(file.path, storedPath);
      chmodSync(storedPath, 0o600); // people's data: readable by the server's account only
      return newId;
    });
    return getDatasetById(db, id);
  } catch (error) {
    if (storedPath) rmSync(storedPath, { force: true });
    throw error;
  } finally {
    rmSync(file.path, { force: true });
  }
}

async function getDatasetById(db: Knex, id: number): Promise<DatasetRecord> {
  const row: DatasetRow | undefined = await selectDatasets(db).where('datasets.id', id).first();
  if (!row) throw notFound(`dataset ${id} does not exist`);
  return toRecord(row);
}

/** A dataset the caller may read (its study is theirs to read); 404 otherwise. */
async function readableRow(db: Knex, caller: User, id: number): Promise<DatasetRow> {
  const row: DatasetRow | undefined = await selectDatasets(db)
    .where('datasets.id', id)
    .modify((builder) => {
      if (!readsEveryStudy(caller)) builder.whereIn('datasets.study_id', memberStudyIds(db, caller.id));
    })
    .first();
  if (!row) throw notFound(`dataset ${id} does not exist`);
  return row;
}

export async function getReadableDataset(db: Knex, caller: User, id: number): Promise<DatasetRecord> {
  return toRecord(await readableRow(db, caller, id));
}

/** The datasets of a study the caller may read, newest first. */
export async function listDatasets(db: Knex, caller: User, studyId: number): Promise<DatasetSummary[]> {
  await getStudy(db, caller, studyId);
  const rows: DatasetRow[] = await selectDatasets(db)
    .where('datasets.study_id', studyId)
    .orderBy([
      { column: 'datasets.created_at', order: 'desc' },
      { column: 'datasets.id', order: 'desc' },
    ]);
  return rows.map(toSummary);
}

/**
 * Counts the categories of the chosen column(s) by reading the stored file again, and keeps
 * them as the dataset's chosen counts. Needs the right to add work to the study.
 */
export async function chooseCounts(db: Knex, dataDir: string, caller: User, id: number, selection: CountSelection): Promise<CategoryCounts> {
  const row = await readableRow(db, caller, id);
  await requireStudyContributor(db, caller, row.study_id);
  const counts = await countsOf(dataDir, row, selection);
  await db.transaction(async (trx) => {
    await trx('datasets').where({ id }).update({ selected_json: JSON.stringify(counts) });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'update',
      entityType: 'dataset',
      entityId: id,
      studyId: row.study_id,
      summary: `chose the counts of dataset "${row.file_name}"`,
      before: row.selected_json === null ? null : { selection: (JSON.parse(row.selected_json) as CategoryCounts).selection },
      after: { selection, categories: counts.labels.length, total: counts.total },
    });
  });
  return counts;
}

/** The counts for a selection: stored ones when the selection was counted before, else from the file. */
export async function countsForSelection(db: Knex, dataDir: string, caller: User, id: number, selection: CountSelection) {
  const row = await readableRow(db, caller, id);
  const known = [...(JSON.parse(row.offered_json) as CategoryCounts[]), ...(row.selected_json ? [JSON.parse(row.selected_json) as CategoryCounts] : [])];
  const same = known.find((counts) => JSON.stringify(counts.selection) === JSON.stringify(selection));
  return { dataset: toSummary(row), counts: same ?? (await countsOf(dataDir, row, selection)) };
}

async function countsOf(dataDir: string, row: DatasetRow, selection: CountSelection): Promise<CategoryCounts> {
  if (!row.stored_file) throw notFound(`the file of dataset ${row.id} is no longer stored`);
  try {
    return await countCategories(join(dataDir, row.stored_file), row.kind, selection);
  } catch (error) {
    throw asUnprocessable(error);
  }
}

/**
 * Deletes a dataset (its uploader or an admin): the file is removed, the row is kept, marked
 * deleted, so analyses that ran on it still name it.
 */
export async function deleteDataset(db: Knex, dataDir: string, caller: User, id: number): Promise<void> {
  const row = await readableRow(db, caller, id);
  if (caller.role !== 'admin' && row.uploaded_by !== caller.id) {
    throw forbidden('only the person who uploaded a dataset or an admin may delete it');
  }
  await db.transaction(async (trx) => {
    await trx('datasets').where({ id }).update({ deleted_at: now(trx), stored_file: null });
    await recordAudit(trx, {
      actorId: caller.id,
      action: 'delete',
      entityType: 'dataset',
      entityId: id,
      studyId: row.study_id,
      summary: `deleted dataset "${row.file_name}"`,
      before: { fileName: row.file_name, sha256: row.sha256, rowCount: Number(row.row_count) },
    });
  });
  if (row.stored_file) rmSync(join(dataDir, row.stored_file), { force: true });
}

/** The file name of a dataset, deleted or not, for reports. */
export async function datasetFileName(db: Knex, id: number | null): Promise<string | null> {
  if (id === null) return null;
  const row = await db('datasets').where({ id }).first('file_name');
  return row?.file_name ?? null;
}
