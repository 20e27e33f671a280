import { createReadStream } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { Writable } from 'node:stream';
import { parse, CsvError } from 'csv-parse';
import { DatasetFormatError } from './dataset-format-error';
import type { RowVisitor } from './table-row';
import { delimiterName, type TextLayout } from './text-sniff';

/**
 * Streams the rows of a CSV or TSV file to `visit`: quoted fields, a byte-order mark, CRLF or LF
 * line ends and empty lines are handled by csv-parse; the file is never held in memory whole.
 * Every row must have as many fields as the header; the first row that differs is named.
 */
export async function readDelimitedRows(path: string, layout: TextLayout, visit: RowVisitor): Promise<void> {
  const parser = parse({
    bom: true,
    encoding: layout.encoding,
    delimiter: layout.delimiter,
    skip_empty_lines: true,
    skip_records_with_empty_values: true,
    relax_column_count: true,
  });
  // Records reach the sink as the parser emits them, so the parser's line count is the record's own
  // (csv-parse's per-record `info` option would copy an object per row and cost more than the parse).
  const where = () => `line ${parser.info.lines}`;
  let width = -1;
  const sink = new Writable({
    objectMode: true,
    highWaterMark: 1024,
    write(record: string[], _encoding, done) {
      try {
        if (width === -1) width = record.length;
        else if (record.length !== width) {
          throw new DatasetFormatError(
            where(),
            `this row has ${plural(record.length, 'field')} but the header has ${width}; check the separator (the header uses ${delimiterName(layout.delimiter)}) and quotes around values that contain it`,
          );
        }
        visit(record, where);
        done();
      } catch (error) {
        done(error as Error);
      }
    },
  });
  try {
    await pipeline(createReadStream(path, { highWaterMark: 256 * 1024 }), parser, sink);
  } catch (error) {
    throw error instanceof CsvError ? fromParserError(error) : error;
  }
}

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** csv-parse's own wording is replaced with ours; its line number is kept. */
function fromParserError(error: CsvError): DatasetFormatError {
  const line = (error as CsvError & { lines?: number }).lines;
  const where = line ? `line ${line}` : 'the file';
  switch (error.code) {
    case 'CSV_QUOTE_NOT_CLOSED':
      return new DatasetFormatError(where, 'a quoted value is opened but never closed before the end of the file');
    case 'CSV_INVALID_CLOSING_QUOTE':
    case 'CSV_NON_TRIMABLE_CHAR_AFTER_CLOSING_QUOTE':
      return new DatasetFormatError(where, 'a quoted value is followed by other characters; double a quote inside a quoted value ("")');
    case 'CSV_MAX_RECORD_SIZE':
      return new DatasetFormatError(where, 'a row is too long to be a table row');
    default:
      return new DatasetFormatError(where, 'the file cannot be read as a table');
  }
}
