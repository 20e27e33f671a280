import type { CountSelection } from '@tallyfit/contracts';

const WHOLE_NUMBER = /^\s*\d+\s*$/;

/**
 * A first guess at how a table's rows become counts: when some column holds only whole numbers
 * and another does not, the rows are probably a label and a count; otherwise each row is one
 * observation of the first column. The person can always change it.
 */
export function guessColumnChoice(columns: readonly string[], preview: readonly (readonly string[])[]): CountSelection | null {
  if (columns.length === 0) return null;
  const numeric = columns.map((_, index) => preview.length > 0 && preview.every((row) => WHOLE_NUMBER.test(row[index] ?? '')));
  const countIndex = numeric.lastIndexOf(true);
  const labelIndex = numeric.indexOf(false);
  if (columns.length >= 2 && countIndex >= 0 && labelIndex >= 0 && preview.length > 0) {
    const labels = preview.map((row) => row[labelIndex]);
    if (new Set(labels).size === labels.length) {
      return { shape: 'counts', labelColumn: columns[labelIndex], countColumn: columns[countIndex] };
    }
  }
  return { shape: 'raw', column: columns[labelIndex >= 0 ? labelIndex : 0] };
}
