/**
 * Reads pasted two-column text (a category and its count per line) into labels and counts.
 * Accepts tabs (as copied from a spreadsheet), commas, semicolons or runs of spaces between the
 * columns; a first line whose second column is not a number is taken as a heading and skipped.
 */
export interface ParsedCounts {
  labels: string[];
  counts: number[];
}

export type PastedCountsOutcome = { ok: true; data: ParsedCounts; skippedHeading: boolean } | { ok: false; errors: string[] };

const WHOLE_NUMBER = /^\d+$/;

function splitLine(line: string): [string, string] | null {
  for (const separator of ['\t', ';', ',']) {
    const at = line.lastIndexOf(separator);
    if (at > 0) return [line.slice(0, at), line.slice(at + 1)];
  }
  const spaced = /^(.*\S)\s+(\S+)$/.exec(line);
  return spaced ? [spaced[1], spaced[2]] : null;
}

const unquote = (value: string): string => value.trim().replace(/^"(.*)"$/, '$1').trim();

export function parsePastedCounts(text: string): PastedCountsOutcome {
  const lines = text
    .split(/\r?\n/)
    .map((line, index) => ({ line: line.trim(), number: index + 1 }))
    .filter(({ line }) => line.length > 0);
  if (lines.length === 0) return { ok: false, errors: ['Paste at least two lines, each a category and its count.'] };

  const errors: string[] = [];
  const labels: string[] = [];
  const counts: number[] = [];
  const seen = new Map<string, number>();
  let skippedHeading = false;
  lines.forEach(({ line, number }, position) => {
    const parts = splitLine(line);
    if (!parts) {
      errors.push(`Line ${number}: expected a category and a count, found only "${line}".`);
      return;
    }
    const label = unquote(parts[0]);
    const countText = unquote(parts[1]).replace(/[\s_]/g, '');
    if (!WHOLE_NUMBER.test(countText)) {
      if (position === 0 && !/\d/.test(countText)) {
        skippedHeading = true;
        return;
      }
      errors.push(`Line ${number}: the count "${parts[1].trim()}" is not a whole number of 0 or more.`);
      return;
    }
    if (label.length === 0) {
      errors.push(`Line ${number}: the category has no name.`);
      return;
    }
    const earlier = seen.get(label);
    if (earlier !== undefined) {
      errors.push(`Line ${number}: the category "${label}" already appears on line ${earlier}.`);
      return;
    }
    seen.set(label, number);
    labels.push(label);
    counts.push(Number(countText));
  });
  if (errors.length > 0) return { ok: false, errors };
  if (labels.length < 2) return { ok: false, errors: [`At least two categories are needed; found ${labels.length}.`] };
  if (counts.every((count) => count === 0)) return { ok: false, errors: ['Every count is 0: at least one observation is needed.'] };
  return { ok: true, data: { labels, counts }, skippedHeading };
}
