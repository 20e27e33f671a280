import { FEW_DISTINCT_VALUES } from './column-profile';
import { LineError } from './delimited-scanner';
import type { ColumnPart, CountPlan, RowsPart, TallyPart } from './row-counter';

/** A range's part with the line its first row started on (range lines count from 1). */
export interface PlacedPart {
  part: RowsPart;
  firstLine: number;
}

/**
 * Joins the parts of consecutive ranges into what one pass over the whole table would have learnt:
 * counts add up, values keep their order of first sight, and a limit passed only by the union is
 * reported on the line where a single pass would have stopped.
 */
export function mergeParts(parts: PlacedPart[], plan: CountPlan): RowsPart {
  const [first, ...rest] = parts;
  const merged: RowsPart = structuredClone(first.part);
  const shift = (lines: number[], firstLine: number) => lines.map((line) => line + firstLine - 1);
  if (merged.tally) {
    merged.tally.firstLines = shift(merged.tally.firstLines, first.firstLine);
    merged.tally.segmentFirstLines = shift(merged.tally.segmentFirstLines, first.firstLine);
  }
  for (const { part, firstLine } of rest) {
    merged.rows += part.rows;
    merged.preview.push(...part.preview.slice(0, Math.max(0, plan.previewRows - merged.preview.length)));
    merged.columns = merged.columns.map((column, i) => mergeColumn(column, part.columns[i]));
    if (merged.tally && part.tally) {
      merged.tally = mergeTally(merged.tally, { ...part.tally, firstLines: shift(part.tally.firstLines, firstLine), segmentFirstLines: shift(part.tally.segmentFirstLines, firstLine) }, plan);
    }
  }
  return merged;
}

function mergeColumn(a: ColumnPart, b: ColumnPart): ColumnPart {
  let values: string[] | null = null;
  let counts: number[] = [];
  if (a.values && b.values) {
    values = [...a.values];
    counts = [...a.counts];
    b.values.forEach((value, i) => {
      const at = values!.indexOf(value);
      if (at === -1) {
        values!.push(value);
        counts.push(b.counts[i]);
      } else counts[at] += b.counts[i];
    });
    if (values.length > FEW_DISTINCT_VALUES) {
      values = null;
      counts = [];
    }
  }
  return { values, counts, wholeNumbers: a.wholeNumbers && b.wholeNumbers, filled: a.filled + b.filled, empty: a.empty + b.empty };
}

/** Labels of `b` joined to those of `a` (which came first); answers the union and where each of b's went. */
function joinLabels(a: string[], aLines: number[], b: string[], bLines: number[]) {
  const labels = [...a];
  const lines = [...aLines];
  const at = new Map(a.map((label, i) => [label, i]));
  const placeOfB = b.map((label, i) => {
    const known = at.get(label);
    if (known !== undefined) return known;
    labels.push(label);
    lines.push(bLines[i]);
    at.set(label, labels.length - 1);
    return labels.length - 1;
  });
  return { labels, lines, placeOfB };
}

function mergeTally(a: TallyPart, b: TallyPart, plan: CountPlan): TallyPart {
  const categories = joinLabels(a.labels, a.firstLines, b.labels, b.firstLines);
  if (categories.labels.length > plan.maxCategories) {
    throw new LineError(
      categories.lines[plan.maxCategories],
      `column "${plan.category?.name}" has more than ${plan.maxCategories} different values, too many for categories; pick the column that holds the category of each row`,
    );
  }
  const segments = a.segments && b.segments ? joinLabels(a.segments, a.segmentFirstLines, b.segments, b.segmentFirstLines) : null;
  if (segments && segments.labels.length > plan.maxSegments) {
    throw new LineError(
      segments.lines[plan.maxSegments],
      `column "${plan.segment?.name}" has more than ${plan.maxSegments} different values, too many for segments; pick a column with fewer (a browser, a country, a line)`,
    );
  }
  const width = categories.labels.length;
  const rows = segments ? segments.labels.length : 1;
  const counts = Array.from({ length: rows }, (_, s) => Array.from({ length: width }, (_, c) => a.counts[s]?.[c] ?? 0));
  b.counts.forEach((row, s) => {
    const target = counts[segments ? segments.placeOfB[s] : 0];
    row.forEach((count, c) => (target[categories.placeOfB[c]] += count));
  });
  return {
    labels: categories.labels,
    firstLines: categories.lines,
    counts,
    segments: segments ? segments.labels : null,
    segmentFirstLines: segments ? segments.lines : [],
    skippedEmpty: a.skippedEmpty + b.skippedEmpty,
    skippedEmptySegment: a.skippedEmptySegment + b.skippedEmptySegment,
  };
}
