import { open, stat } from 'node:fs/promises';
import { availableParallelism } from 'node:os';
import type { CategoryCounts, CountSelection, DatasetColumn, SegmentCounts } from '@tallyfit/contracts';
import { DATASET_MAX_CATEGORIES, DATASET_MAX_SEGMENTS, DATASET_PREVIEW_ROWS } from '@tallyfit/contracts';
import { columnIndex, countsTableTally, type CategoryTally } from './category-tally';
import { isBlankCell, cellString } from './cell-text';
import { columnSummary, MAX_OFFERED_COLUMNS, naturalOrder, offeredCounts } from './column-profile';
import { DatasetFormatError } from './dataset-format-error';
import { LineError, scanDelimitedRange, type RowFields } from './delimited-scanner';
import type { FileKind } from './file-kind';
import { countRanges, defaultScanWorkerFile } from './range-threads';
import type { RangeJob, RangeOutcome } from './range-count';
import { RowCounter, type CountPlan, type RowsPart } from './row-counter';
import { mergeParts, type PlacedPart } from './rows-part-merge';
import { delimiterName, sniffTextLayout } from './text-sniff';
import { readXlsxRows } from './xlsx-rows';

/** Wider tables are refused: a table of categories has a handful of columns, not thousands. */
export const MAX_COLUMNS = 500;
/** Text tables at least this large are counted in worker threads, one byte range each. */
const THREADED_FROM_BYTES = 8 * 1024 * 1024;
/** The work is split into at most this many ranges (the product is sized for two cores). */
const MAX_THREADS = 2;

export interface DatasetScan {
  columns: DatasetColumn[];
  /** data rows, the header not included */
  rowCount: number;
  preview: string[][];
  offeredCounts: CategoryCounts[];
  selectedCounts: CategoryCounts | null;
}

export interface ScanOptions {
  /** the worker script for large text tables; null counts in this thread (default: the built worker, else the source runner) */
  workerFile?: string | null;
}

interface ReadRequest {
  profile: boolean;
  previewRows: number;
  selection?: CountSelection;
  segmentColumn?: string;
}

interface TableRead {
  names: string[];
  part: RowsPart;
  /** the counts of a table of counts (`shape: 'counts'`), read as text */
  countsTable?: CategoryTally;
  /** the line (or row) after the header, for "no data rows" */
  afterHeader: string;
}

/**
 * Reads a table once: the header names the columns, the first rows are kept as a preview, every
 * column is profiled in bounded memory and, when a selection is given, its category counts are
 * taken. Text tables are read by bytes, large ones in two worker threads (one half each).
 */
export async function scanTable(path: string, kind: FileKind, selection?: CountSelection, options: ScanOptions = {}): Promise<DatasetScan> {
  const read = await readTable(path, kind, { profile: true, previewRows: DATASET_PREVIEW_ROWS, selection }, options);
  const { names, part } = read;
  return {
    columns: part.columns.map((column, i) => columnSummary(names[i], column)),
    rowCount: part.rows,
    preview: part.preview,
    offeredCounts: part.columns
      .map((column, i) => offeredCounts(names[i], column))
      .filter((counts): counts is CategoryCounts => counts !== undefined)
      .slice(0, MAX_OFFERED_COLUMNS),
    selectedCounts: selection ? selectedCounts(read, selection) : null,
  };
}

/** Only the counts of a selection: a second pass over a stored file, without profiling. */
export async function countCategories(path: string, kind: FileKind, selection: CountSelection, options: ScanOptions = {}): Promise<CategoryCounts> {
  return selectedCounts(await readTable(path, kind, { profile: false, previewRows: 0, selection }, options), selection);
}

/** The counts of a raw category column split by a second (segment) column, in one pass. */
export async function countSegments(
  path: string,
  kind: FileKind,
  selection: Extract<CountSelection, { shape: 'raw' }>,
  segmentColumn: string,
  options: ScanOptions = {},
): Promise<SegmentCounts> {
  if (segmentColumn === selection.column) {
    throw new DatasetFormatError('line 1', `the segment column must differ from the category column "${selection.column}"`);
  }
  const { part } = await readTable(path, kind, { profile: false, previewRows: 0, selection, segmentColumn }, options);
  const tally = part.tally!;
  const labelOrder = order(tally.labels);
  const segments = order(tally.segments!).map((s) => {
    const counts = labelOrder.map((c) => tally.counts[s]?.[c] ?? 0);
    return { segment: tally.segments![s], counts, total: sum(counts) };
  });
  return {
    selection,
    segmentColumn,
    labels: labelOrder.map((c) => tally.labels[c]),
    segments,
    total: sum(segments.map((segment) => segment.total)),
    skippedEmpty: tally.skippedEmpty,
    skippedEmptySegment: tally.skippedEmptySegment,
  };
}

const sum = (values: number[]) => values.reduce((a, b) => a + b, 0);
const order = (labels: string[]) => labels.map((_, i) => i).sort((a, b) => naturalOrder(labels[a], labels[b]));

function selectedCounts(read: TableRead, selection: CountSelection): CategoryCounts {
  if (read.countsTable) return read.countsTable.finish();
  const tally = read.part.tally!;
  const labelOrder = order(tally.labels);
  const counts = labelOrder.map((c) => tally.counts[0]?.[c] ?? 0);
  return { selection, labels: labelOrder.map((c) => tally.labels[c]), counts, total: sum(counts), skippedEmpty: tally.skippedEmpty };
}

async function readTable(path: string, kind: FileKind, request: ReadRequest, options: ScanOptions): Promise<TableRead> {
  const read = kind === 'xlsx' ? await readWorkbook(path, request) : await readText(path, kind, request, options);
  if (read.part.rows === 0) throw new DatasetFormatError(read.afterHeader, 'the file has a header but no data rows');
  return read;
}

/** The plan for the rows once the header is known; a table of counts is also read as text, row by row. */
function planFor(names: string[], request: ReadRequest, separatorName: string, encoding: CountPlan['encoding']) {
  const plan: CountPlan = {
    encoding,
    width: names.length,
    separatorName,
    profile: request.profile,
    previewRows: request.previewRows,
    maxCategories: DATASET_MAX_CATEGORIES,
    maxSegments: DATASET_MAX_SEGMENTS,
  };
  let countsTable: CategoryTally | undefined;
  const selection = request.selection;
  if (selection?.shape === 'raw') {
    plan.category = { index: columnIndex(names, selection.column, 'categories'), name: selection.column };
    if (request.segmentColumn !== undefined) plan.segment = { index: columnIndex(names, request.segmentColumn, 'segments'), name: request.segmentColumn };
  } else if (selection?.shape === 'counts') {
    countsTable = countsTableTally(names, selection);
  }
  return { plan, countsTable };
}

async function readText(path: string, kind: Exclude<FileKind, 'xlsx'>, request: ReadRequest, options: ScanOptions): Promise<TableRead> {
  const layout = await sniffTextLayout(path, kind);
  const delimiter = layout.delimiter.charCodeAt(0);
  const header = await readHeader(path, delimiter, layout.encoding);
  const names = columnNames(header.cells, `line ${header.line}`);
  const { plan, countsTable } = planFor(names, request, delimiterName(layout.delimiter), layout.encoding);
  const firstDataLine = header.lineBreaks + 1;
  const afterHeader = `line ${header.line + 1}`;
  const size = (await stat(path)).size;

  if (countsTable) {
    // A table of counts is small and read as text in this thread; its errors name their line.
    const counter = new RowCounter(plan, (cells, line) => countsTable.add(cells, () => `line ${line + firstDataLine - 1}`));
    const part = inThisThread(() => {
      scanDelimitedRange(path, { delimiter, start: header.stoppedAt, end: size, capacity: plan.width + 1 }, counter.add);
      return counter.part();
    }, firstDataLine);
    return { names, part, countsTable, afterHeader };
  }

  const workerFile = options.workerFile === undefined ? defaultScanWorkerFile() : options.workerFile;
  const threads = size - header.stoppedAt >= THREADED_FROM_BYTES && workerFile !== null ? Math.min(MAX_THREADS, availableParallelism()) : 1;
  const bounds = [header.stoppedAt, ...(await splitPoints(path, header.stoppedAt, size, threads)), size];
  const jobs: RangeJob[] = bounds.slice(1).map((end, i) => ({ path, delimiter, start: bounds[i], end, plan }));
  const outcomes = await countRanges(jobs, threads > 1 ? workerFile : null);

  const placed: PlacedPart[] = [];
  let firstLine = firstDataLine;
  let expectedStart = header.stoppedAt;
  for (let i = 0; i < jobs.length; i++) {
    let outcome = outcomes[i];
    if (jobs[i].start !== expectedStart) {
      // A quoted value with a line break straddled the split: the rest is read again from where the previous range stopped.
      [outcome] = await countRanges([{ ...jobs[i], start: expectedStart, end: size }], workerFile);
      i = jobs.length;
    }
    const done = unwrap(outcome, firstLine);
    placed.push({ part: done.part, firstLine });
    firstLine += done.lineBreaks;
    expectedStart = done.stoppedAt;
  }
  const part = placed.length === 1 ? placed[0].part : inThisThread(() => mergeParts(placed, plan), 1);
  return { names, part, afterHeader };
}

/** A range's outcome, its line errors renumbered from the range's first line to the file's. */
function unwrap(outcome: RangeOutcome, firstLine: number) {
  if (outcome.ok) return outcome.done;
  if ('line' in outcome) throw new DatasetFormatError(`line ${outcome.line + firstLine - 1}`, outcome.problem);
  if ('where' in outcome) throw new DatasetFormatError(outcome.where, outcome.problem);
  throw new Error(outcome.message);
}

/** Runs a count in this thread, renumbering its line errors as `unwrap` does. */
function inThisThread<T>(count: () => T, firstLine: number): T {
  try {
    return count();
  } catch (error) {
    if (error instanceof LineError) throw new DatasetFormatError(`line ${error.line + firstLine - 1}`, error.problem);
    throw error;
  }
}

/** Offsets just after a line break near each 1/n of the data, so each range starts a line (checked after the count). */
async function splitPoints(path: string, start: number, size: number, parts: number): Promise<number[]> {
  const points: number[] = [];
  const handle = await open(path, 'r');
  try {
    const block = Buffer.alloc(64 * 1024);
    for (let k = 1; k < parts; k++) {
      let at = start + Math.floor(((size - start) * k) / parts);
      let found = -1;
      while (found === -1 && at < size) {
        const { bytesRead } = await handle.read(block, 0, block.length, at);
        const lineBreak = block.subarray(0, bytesRead).indexOf(0x0a);
        if (lineBreak >= 0) found = at + lineBreak + 1;
        else at += bytesRead;
      }
      if (found === -1 || found >= size || found <= (points.at(-1) ?? start)) break;
      points.push(found);
    }
  } finally {
    await handle.close();
  }
  return points;
}

/** The first row with any text: its cells, its line and where the data rows start. */
async function readHeader(path: string, delimiter: number, encoding: CountPlan['encoding']) {
  const handle = await open(path, 'r');
  const bom = Buffer.alloc(3);
  await handle.read(bom, 0, 3, 0).finally(() => handle.close());
  const start = bom.equals(Buffer.from([0xef, 0xbb, 0xbf])) ? 3 : 0;
  let found: { cells: string[]; line: number } | undefined;
  const outcome = inThisThread(
    () =>
      scanDelimitedRange(path, { delimiter, start, end: Infinity, capacity: MAX_COLUMNS + 1 }, (row: RowFields) => {
        if (row.count > MAX_COLUMNS) throw new LineError(row.line, `the header has ${row.count} columns; at most ${MAX_COLUMNS} are read`);
        const cells: string[] = [];
        let blank = true;
        for (let i = 0; i < row.count; i++) {
          if (blank && !isBlankCell(row.bytes, row.starts[i], row.ends[i], encoding)) blank = false;
          cells.push(cellString(row.bytes, row.starts[i], row.ends[i], encoding));
        }
        if (blank) return false;
        found = { cells, line: row.line };
        return true;
      }),
    1,
  );
  if (!found) throw new DatasetFormatError('line 1', 'the file has no header row');
  return { ...(found as { cells: string[]; line: number }), ...outcome };
}

/** The first worksheet of a workbook, its rows given to the same counter as text tables' rows. */
async function readWorkbook(path: string, request: ReadRequest): Promise<TableRead> {
  let names: string[] | undefined;
  let counter: RowCounter | undefined;
  let countsTable: CategoryTally | undefined;
  let afterHeader = 'row 2';
  await readXlsxRows(path, (cells, rowNumber) => {
    if (!counter) {
      names = columnNames(cells, `row ${rowNumber}`);
      afterHeader = `row ${rowNumber + 1}`;
      const planned = planFor(names, request, 'columns', 'utf8');
      countsTable = planned.countsTable;
      counter = new RowCounter(planned.plan, countsTable ? (text, row) => countsTable!.add(text, () => `row ${row}`) : undefined);
      return;
    }
    try {
      counter.add(rowOfCells(cells, rowNumber));
    } catch (error) {
      if (error instanceof LineError) throw new DatasetFormatError(`row ${error.line}`, error.problem);
      throw error;
    }
  });
  if (!counter || !names) throw new DatasetFormatError('row 1', 'the worksheet has no header row');
  return { names, part: counter.part(), countsTable, afterHeader };
}

/** A worksheet row's cells laid out as bytes, as the counter reads text tables. */
function rowOfCells(cells: string[], rowNumber: number): RowFields {
  const bytes = Buffer.from(cells.join(''), 'utf8');
  const starts = new Int32Array(cells.length + 1);
  const ends = new Int32Array(cells.length + 1);
  let at = 0;
  cells.forEach((cell, i) => {
    starts[i] = at;
    at += Buffer.byteLength(cell, 'utf8');
    ends[i] = at;
  });
  return { bytes, starts, ends, count: cells.length, line: rowNumber };
}

/** Header cells become column names: trimmed, blanks named by position, repeats numbered. */
function columnNames(cells: string[], where: string): string[] {
  if (cells.length > MAX_COLUMNS) {
    throw new DatasetFormatError(where, `the header has ${cells.length} columns; at most ${MAX_COLUMNS} are read`);
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
