import type { CategoryCounts, CountSelection } from '@tallyfit/contracts';
import { DATASET_MAX_CATEGORIES } from '@tallyfit/contracts';
import { DatasetFormatError } from './dataset-format-error';

/** Accumulates category counts row by row (raw rows are counted by bytes in row-counter.ts). */
export interface CategoryTally {
  add(cells: string[], where: () => string): void;
  finish(): CategoryCounts;
}

/** A whole number ≥ 0 written plainly ("12", "12.0"), as a count column holds. */
export function parseCount(text: string): number | undefined {
  if (!/^\d+(\.0*)?$/.test(text)) return undefined;
  const value = Number(text);
  return Number.isSafeInteger(value) ? value : undefined;
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
  const firstSeen = new Map<string, string>();
  const labels: string[] = [];
  const counts: number[] = [];
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
      const count = parseCount(text);
      if (count === undefined) {
        const problem = /^-\s*\d/.test(text) ? 'is negative' : /^\d*\.\d+$/.test(text) ? 'is not a whole number' : 'is not a number';
        throw new DatasetFormatError(where(), `the count "${text}" for "${label}" in column "${selection.countColumn}" ${problem}; counts are whole numbers of 0 or more`);
      }
      const earlier = firstSeen.get(label);
      if (earlier !== undefined) {
        throw new DatasetFormatError(where(), `the label "${label}" appears a second time (first on ${earlier}); each category needs one row`);
      }
      if (labels.length >= DATASET_MAX_CATEGORIES) {
        throw new DatasetFormatError(where(), `the table has more than ${DATASET_MAX_CATEGORIES} categories`);
      }
      firstSeen.set(label, where());
      labels.push(label);
      counts.push(count);
    },
    finish() {
      return { selection, labels, counts, total: counts.reduce((a, b) => a + b, 0), skippedEmpty };
    },
  };
}
