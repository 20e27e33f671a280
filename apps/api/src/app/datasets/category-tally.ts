import type { CategoryCounts, CountSelection } from '@tallyfit/contracts';
import { DATASET_MAX_CATEGORIES, readCount, readCountColumn } from '@tallyfit/contracts';
import { DatasetFormatError } from './dataset-format-error';

/** Accumulates category counts row by row (raw rows are counted by bytes in row-counter.ts). */
export interface CategoryTally {
  add(cells: string[], where: () => string): void;
  finish(): CategoryCounts;
}

/** A count written as people write it ("12", "1,234", "1 234"; `readCount` in contracts holds the rule), or undefined. */
export function parseCount(text: string): number | undefined {
  const reading = readCount(text);
  return reading.ok ? reading.value : undefined;
}

/** Where the named column is in the header; an error naming the columns when it is not there. */
export function columnIndex(header: string[], name: string, role: string): number {
  const index = header.indexOf(name);
  if (index === -1) {
    throw new DatasetFormatError('line 1', `there is no column named "${name}" for the ${role}; the columns are ${header.map((h) => `"${h}"`).join(', ')}`);
  }
  return index;
}

/** A table of counts: one row per category, its label in one column and how many were seen in another. */
export function countsTableTally(header: string[], selection: Extract<CountSelection, { shape: 'counts' }>): CategoryTally {
  const labelIndex = columnIndex(header, selection.labelColumn, 'labels');
  const countIndex = columnIndex(header, selection.countColumn, 'counts');
  if (labelIndex === countIndex) throw new DatasetFormatError('line 1', 'the label column and the count column must be different columns');
  const countProblem = (text: string, label: string, message: string) =>
    `the count "${text}" for "${label}" in column "${selection.countColumn}" ${message}; counts are whole numbers of 0 or more`;
  const firstSeen = new Map<string, string>();
  const labels: string[] = [];
  const texts: string[] = [];
  const places: string[] = [];
  let skippedEmpty = 0;
  return {
    add(cells, where) {
      const label = cells[labelIndex].trim();
      const text = cells[countIndex].trim();
      if (label === '' && text === '') {
        skippedEmpty++;
        return;
      }
      if (label === '') throw new DatasetFormatError(where(), `the label in column "${selection.labelColumn}" is empty`);
      if (text === '') throw new DatasetFormatError(where(), `the count for "${label}" in column "${selection.countColumn}" is empty`);
      // A count wrong in itself is named at once, in file order; only an ambiguous one waits for the whole column.
      const reading = readCount(text);
      if (!reading.ok && reading.problem !== 'ambiguous') throw new DatasetFormatError(where(), countProblem(text, label, reading.message));
      const earlier = firstSeen.get(label);
      if (earlier !== undefined) {
        throw new DatasetFormatError(where(), `the label "${label}" appears a second time (first on ${earlier}); each category needs one row`);
      }
      if (labels.length >= DATASET_MAX_CATEGORIES) {
        throw new DatasetFormatError(where(), `the table has more than ${DATASET_MAX_CATEGORIES} categories`);
      }
      firstSeen.set(label, where());
      labels.push(label);
      texts.push(text);
      places.push(where());
    },
    finish() {
      // The column is read as a whole, so "1,000" is settled by "1,020" further down.
      const reading = readCountColumn(texts);
      const [problem] = reading.problems;
      if (problem) {
        const { index, message } = problem;
        throw new DatasetFormatError(places[index], countProblem(texts[index], labels[index], message));
      }
      const counts = reading.values as number[];
      return {
        selection,
        labels,
        counts,
        total: counts.reduce((a, b) => a + b, 0),
        skippedEmpty,
        ...(reading.decisions.length ? { countDecisions: reading.decisions } : {}),
      };
    },
  };
}
