/**
 * Reads pasted two-column text (a category and its count per line) into labels and counts.
 * Accepts tabs (as copied from a spreadsheet), semicolons, commas or runs of spaces between the
 * columns; a first line whose second column holds no digit is taken as a heading and skipped.
 * Counts may carry thousands separators ("1,234", "1.234", "1 234"): they are read as one column
 * by `readCountColumn` (contracts), which says how it read them and names ambiguous values.
 */
import { readCount, readCountColumn } from '@tallyfit/contracts';

export interface ParsedCounts {
  labels: string[];
  counts: number[];
}

export type PastedCountsOutcome =
  | { ok: true; data: ParsedCounts; skippedHeading: boolean; /** how separators in the counts were read */ decisions: string[] }
  | { ok: false; errors: string[] };

const readable = (text: string) => {
  const reading = readCount(text);
  return reading.ok || reading.problem === 'ambiguous';
};

/** The label and the count text of one line, or null when there is only one column. */
function splitLine(line: string): [string, string] | null {
  const quotedCount = /^(.*?)\s*[\t;,]\s*"([^"]*)"$/.exec(line);
  if (quotedCount) return [quotedCount[1], quotedCount[2]];
  for (const separator of ['\t', ';']) {
    const at = line.lastIndexOf(separator);
    if (at > 0) return [line.slice(0, at), line.slice(at + 1)];
  }
  if (line.includes(',')) {
    // The longest tail that reads as a count, so "red,1,234" is red and 1,234 while "North, upper floor,12" keeps its comma.
    for (let at = line.indexOf(','); at > 0; at = line.indexOf(',', at + 1)) {
      if (readable(line.slice(at + 1).trim())) return [line.slice(0, at), line.slice(at + 1)];
    }
    const last = line.lastIndexOf(',');
    if (last > 0) return [line.slice(0, last), line.slice(last + 1)];
  }
  const spaced = /^(.*?\S)\s+(\d{1,3}(?:[ \u00a0\u202f]\d{3})+|\S+)$/.exec(line);
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
  const rows: Array<{ label: string; countText: string; number: number }> = [];
  const seen = new Map<string, number>();
  let skippedHeading = false;
  lines.forEach(({ line, number }, position) => {
    const parts = splitLine(line);
    if (!parts) {
      errors.push(`Line ${number}: expected a category and a count, found only "${line}".`);
      return;
    }
    const label = unquote(parts[0]);
    const countText = unquote(parts[1]);
    if (position === 0 && !/\d/.test(countText)) {
      skippedHeading = true;
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
    rows.push({ label, countText, number });
  });

  const reading = readCountColumn(rows.map((row) => row.countText));
  for (const { index, problem, message } of reading.problems) {
    const { number, countText } = rows[index];
    errors.push(
      problem === 'ambiguous' ? `Line ${number}: the count "${countText}" ${message}.` : `Line ${number}: the count "${countText}" is not a whole number of 0 or more.`,
    );
  }
  if (errors.length > 0) return { ok: false, errors: errors.sort((a, b) => lineOf(a) - lineOf(b)) };
  const labels = rows.map((row) => row.label);
  const counts = reading.values as number[];
  if (labels.length < 2) return { ok: false, errors: [`At least two categories are needed; found ${labels.length}.`] };
  if (counts.every((count) => count === 0)) return { ok: false, errors: ['Every count is 0: at least one observation is needed.'] };
  return { ok: true, data: { labels, counts }, skippedHeading, decisions: reading.decisions };
}

const lineOf = (message: string) => Number(/^Line (\d+)/.exec(message)?.[1] ?? 0);
