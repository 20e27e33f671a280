import { cellString, isBlankCell, isCountCell, type TextEncoding } from './cell-text';
import { FEW_DISTINCT_VALUES } from './column-profile';
import { LineError, type RowFields } from './delimited-scanner';
import { BLANK, LabelIndex, TOO_MANY } from './label-index';

/** What to learn from the rows of a table (all of it or one byte range of it). */
export interface CountPlan {
  encoding: TextEncoding;
  /** the header's number of columns; every row must have as many */
  width: number;
  /** said in the message about a row with the wrong number of fields ("commas") */
  separatorName: string;
  /** profile every column (at upload) */
  profile: boolean;
  /** the first rows kept as text */
  previewRows: number;
  /** the column whose categories are counted (raw rows) */
  category?: { index: number; name: string };
  /** a second column splitting the counts into segments */
  segment?: { index: number; name: string };
  /** the limits on different categories and segments (from contracts, passed in so the worker needs no schemas) */
  maxCategories: number;
  maxSegments: number;
}

/** One column's profile over the rows read: its values (while few) with counts, and what they look like. */
export interface ColumnPart {
  /** the different values in order of first sight, or null once there were more than FEW_DISTINCT_VALUES */
  values: string[] | null;
  counts: number[];
  wholeNumbers: boolean;
  filled: number;
  empty: number;
}

/** The counts of the category column (one row of counts per segment when a segment column is given). */
export interface TallyPart {
  labels: string[];
  firstLines: number[];
  /** counts[s][c]: rows of segment s (or the only row, without segments) in category c */
  counts: number[][];
  segments: string[] | null;
  segmentFirstLines: number[];
  skippedEmpty: number;
  skippedEmptySegment: number;
}

/** What the rows of one range taught; parts of consecutive ranges merge into the table's whole. */
export interface RowsPart {
  rows: number;
  preview: string[][];
  columns: ColumnPart[];
  tally: TallyPart | null;
}

/** A column's profile while its values are few: labels known by bytes, so each cell costs one lookup. */
class ColumnWatch {
  private index: LabelIndex | undefined;
  private counts = new Float64Array(FEW_DISTINCT_VALUES);
  private countLike: boolean[] = [];
  private wholeNumbers = true;
  private filled = 0;
  private empty = 0;

  constructor(private readonly encoding: TextEncoding) {
    this.index = new LabelIndex(encoding, FEW_DISTINCT_VALUES);
  }

  add(bytes: Uint8Array, start: number, end: number, line: number): void {
    const index = this.index;
    if (index) {
      const label = index.of(bytes, start, end, line);
      if (label === BLANK) {
        this.empty++;
        return;
      }
      if (label !== TOO_MANY) {
        this.filled++;
        this.counts[label]++;
        if (this.countLike.length === label) this.countLike.push(isCountCell(bytes, start, end, this.encoding));
        if (!this.countLike[label]) this.wholeNumbers = false;
        return;
      }
      // More different values than a category column has: from here on only their look is kept.
      this.index = undefined;
    }
    if (isBlankCell(bytes, start, end, this.encoding)) {
      this.empty++;
      return;
    }
    this.filled++;
    if (this.wholeNumbers && !isCountCell(bytes, start, end, this.encoding)) this.wholeNumbers = false;
  }

  part(): ColumnPart {
    const values = this.index ? [...this.index.labels] : null;
    return {
      values,
      counts: values ? Array.from(this.counts.subarray(0, values.length)) : [],
      wholeNumbers: this.wholeNumbers,
      filled: this.filled,
      empty: this.empty,
    };
  }
}

/**
 * Learns from rows given as bytes (`RowFields`): skips rows with no text in any cell, refuses a row
 * with the wrong number of fields (naming its line), keeps the first rows as text, profiles every
 * column and counts the chosen category column, split by a segment column when one is given.
 */
export class RowCounter {
  private rows = 0;
  private readonly preview: string[][] = [];
  private readonly watches: ColumnWatch[];
  private readonly categories: LabelIndex | undefined;
  private readonly segments: LabelIndex | undefined;
  private readonly counts: Float64Array[] = [];
  private skippedEmpty = 0;
  private skippedEmptySegment = 0;

  /**
   * @param visitCells also given each counted row as text (a table of counts is read this way: it is small)
   */
  constructor(
    private readonly plan: CountPlan,
    private readonly visitCells?: (cells: string[], line: number) => void,
  ) {
    this.watches = plan.profile ? Array.from({ length: plan.width }, () => new ColumnWatch(plan.encoding)) : [];
    if (plan.category) {
      this.categories = new LabelIndex(plan.encoding, plan.maxCategories);
      if (plan.segment) this.segments = new LabelIndex(plan.encoding, plan.maxSegments);
      else this.counts.push(new Float64Array(plan.maxCategories));
    }
  }

  readonly add = (row: RowFields): void => {
    const { bytes, starts, ends, count, line } = row;
    const plan = this.plan;
    if (count !== plan.width) {
      if (this.isBlankRow(row)) return;
      throw new LineError(
        line,
        `this row has ${count} field${count === 1 ? '' : 's'} but the header has ${plan.width}; check the separator (the header uses ${plan.separatorName}) and quotes around values that contain it`,
      );
    }
    if (starts[0] === ends[0] || bytes[starts[0]] <= 0x20 || bytes[starts[0]] >= 0x80) {
      if (this.isBlankRow(row)) return;
    }
    this.rows++;
    if (this.preview.length < plan.previewRows || this.visitCells) {
      const cells: string[] = [];
      for (let i = 0; i < count; i++) cells.push(cellString(bytes, starts[i], ends[i], plan.encoding));
      if (this.preview.length < plan.previewRows) this.preview.push(cells);
      this.visitCells?.(cells, line);
    }
    const watches = this.watches;
    for (let i = 0; i < watches.length; i++) watches[i].add(bytes, starts[i], ends[i], line);
    if (this.categories) this.countCategory(row);
  };

  private countCategory({ bytes, starts, ends, line }: RowFields): void {
    const plan = this.plan;
    const column = plan.category!.index;
    const label = this.categories!.of(bytes, starts[column], ends[column], line);
    if (label === TOO_MANY) {
      throw new LineError(
        line,
        `column "${plan.category!.name}" has more than ${plan.maxCategories} different values, too many for categories; pick the column that holds the category of each row`,
      );
    }
    if (label === BLANK) {
      this.skippedEmpty++;
      return;
    }
    if (!this.segments) {
      this.counts[0][label]++;
      return;
    }
    const by = plan.segment!.index;
    const segment = this.segments.of(bytes, starts[by], ends[by], line);
    if (segment === TOO_MANY) {
      throw new LineError(
        line,
        `column "${plan.segment!.name}" has more than ${plan.maxSegments} different values, too many for segments; pick a column with fewer (a browser, a country, a line)`,
      );
    }
    if (segment === BLANK) {
      this.skippedEmptySegment++;
      return;
    }
    if (segment === this.counts.length) this.counts.push(new Float64Array(plan.maxCategories));
    this.counts[segment][label]++;
  }

  /** No cell has any text: such rows are skipped, as spreadsheets leave them (",,,"). */
  private isBlankRow({ bytes, starts, ends, count }: RowFields): boolean {
    if (count > starts.length) return false;
    for (let i = 0; i < count && i < starts.length; i++) if (!isBlankCell(bytes, starts[i], ends[i], this.plan.encoding)) return false;
    return true;
  }

  part(): RowsPart {
    const categories = this.categories;
    const labelCount = categories?.labels.length ?? 0;
    return {
      rows: this.rows,
      preview: this.preview,
      columns: this.watches.map((watch) => watch.part()),
      tally: categories
        ? {
            labels: categories.labels,
            firstLines: categories.firstLines,
            counts: this.counts.map((row) => Array.from(row.subarray(0, labelCount))),
            segments: this.segments ? this.segments.labels : null,
            segmentFirstLines: this.segments ? this.segments.firstLines : [],
            skippedEmpty: this.skippedEmpty,
            skippedEmptySegment: this.skippedEmptySegment,
          }
        : null,
    };
  }
}
