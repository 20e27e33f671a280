import type { CategoryCounts, CountSelection, DatasetColumn } from '@tallyfit/contracts';
import { DATASET_PREVIEW_ROWS } from '@tallyfit/contracts';
import { createCategoryTally, type CategoryTally } from './category-tally';
import { ColumnProfile, MAX_OFFERED_COLUMNS } from './column-profile';
import { DatasetFormatError } from './dataset-format-error';
import type { FileKind } from './file-kind';
import { readTableRows } from './table-rows';

/** Wider tables are refused: a table of categories has a handful of columns, not thousands. */
export const MAX_COLUMNS = 500;

export interface DatasetScan {
  columns: DatasetColumn[];
  /** data rows, the header not included */
  rowCount: number;
  preview: string[][];
  offeredCounts: CategoryCounts[];
  selectedCounts: CategoryCounts | null;
}

/**
 * Reads a table once, row by row: the header names the columns, the first rows are kept as a
 * preview, every column is profiled in bounded memory and, when a selection is given, its
 * category counts are taken. Memory does not grow with the number of rows.
 */
export async function scanTable(path: string, kind: FileKind, selection?: CountSelection): Promise<DatasetScan> {
  let header: string[] | undefined;
  let profiles: ColumnProfile[] = [];
  let tally: CategoryTally | undefined;
  const preview: string[][] = [];
  let rowCount = 0;
  await readTableRows(path, kind, (cells, where) => {
    if (!header) {
      header = columnNames(cells, where);
      profiles = header.map((name) => new ColumnProfile(name));
      if (selection) tally = createCategoryTally(header, selection);
      return;
    }
    rowCount++;
    if (preview.length < DATASET_PREVIEW_ROWS) preview.push(cells);
    for (let i = 0; i < profiles.length; i++) profiles[i].add(cells[i]);
    tally?.add(cells, where);
  });
  if (!header) throw new DatasetFormatError('line 1', 'the file has no header row');
  if (rowCount === 0) throw new DatasetFormatError('line 2', 'the file has a header but no data rows');
  return {
    columns: profiles.map((profile) => profile.summary()),
    rowCount,
    preview,
    offeredCounts: profiles
      .map((profile) => profile.offeredCounts())
      .filter((counts): counts is CategoryCounts => counts !== undefined)
      .slice(0, MAX_OFFERED_COLUMNS),
    selectedCounts: tally ? tally.finish() : null,
  };
}

/** Only the counts of a selection: a second pass over a stored file, without profiling. */
export async function countCategories(path: string, kind: FileKind, selection: CountSelection): Promise<CategoryCounts> {
  let tally: CategoryTally | undefined;
  await readTableRows(path, kind, (cells, where) => {
    if (!tally) tally = createCategoryTally(columnNames(cells, where), selection);
    else tally.add(cells, where);
  });
  if (!tally) throw new DatasetFormatError('line 1', 'the file has no header row');
  return tally.finish();
}

/** Header cells become column names: trimmed, blanks named by position, repeats numbered. */
function columnNames(cells: string[], where: () => string): string[] {
  if (cells.length > MAX_COLUMNS) {
    throw new DatasetFormatError(where(), `the header has ${cells.length} columns; at most ${MAX_COLUMNS} are read`);
  }
  const used = new Set<string>();
  return cells.map((cell, i) => {
    const base = cell.trim() || `column ${i + 1}`;
    let name = base;
    for (let n = 2; used.has(name); n++) name = `${base} (${n})`;
    used.add(name);
    return name;
  });
}
