import ExcelJS from 'exceljs';
import { DatasetFormatError } from './dataset-format-error';

/**
 * Streams the rows of the first worksheet of an XLSX workbook to `visit` (with the sheet's row
 * number) with exceljs's streaming reader, so large sheets are never held in memory whole. Empty rows are skipped; shorter rows are
 * padded to the header's width; a value beyond the header's last column is an error naming the row.
 */
export async function readXlsxRows(path: string, visit: (cells: string[], rowNumber: number) => void): Promise<void> {
  const reader = new ExcelJS.stream.xlsx.WorkbookReader(path, {
    worksheets: 'emit',
    sharedStrings: 'cache',
    hyperlinks: 'ignore',
    styles: 'ignore',
    entries: 'ignore',
  });
  let width = -1;
  let sawSheet = false;
  try {
    for await (const worksheet of reader) {
      sawSheet = true;
      for await (const row of worksheet as AsyncIterable<ExcelJS.Row>) {
        // row.values is 1-based and sparse: index 0 is always empty.
        const values = (row.values as unknown[]).slice(1).map(cellText);
        if (values.every((value) => value === '')) continue;
        const where = () => `row ${row.number}`;
        if (width === -1) {
          width = lastFilled(values) + 1;
        } else if (lastFilled(values) >= width) {
          throw new DatasetFormatError(where(), `a value sits in column ${columnLetter(lastFilled(values))}, beyond the header's last column ${columnLetter(width - 1)}`);
        }
        while (values.length < width) values.push('');
        visit(values.slice(0, width), row.number);
      }
      // Only the first worksheet is read.
      break;
    }
  } catch (error) {
    if (error instanceof DatasetFormatError) throw error;
    throw new DatasetFormatError('the file', 'it is not a readable XLSX workbook (the zip archive or its sheet data is damaged)');
  }
  if (!sawSheet) throw new DatasetFormatError('the file', 'the workbook has no worksheet');
}

function lastFilled(values: string[]): number {
  for (let i = values.length - 1; i >= 0; i--) if (values[i] !== '') return i;
  return -1;
}

function columnLetter(index: number): string {
  let name = '';
  for (let n = index + 1; n > 0; n = Math.floor((n - 1) / 26)) name = String.fromCharCode(65 + ((n - 1) % 26)) + name;
  return name;
}

/** The text a person sees in a cell: formula results, rich text and hyperlinks reduced to their text. */
function cellText(value: unknown): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'string') return value.trim();
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  if (value instanceof Date) return value.toISOString().slice(0, 10);
  if (typeof value === 'object') {
    const cell = value as { richText?: Array<{ text: string }>; result?: unknown; text?: unknown; error?: string };
    if (cell.richText) return cell.richText.map((part) => part.text).join('').trim();
    if ('result' in cell) return cellText(cell.result);
    if (cell.text !== undefined) return cellText(cell.text);
    if (cell.error) return cell.error;
  }
  return String(value);
}
