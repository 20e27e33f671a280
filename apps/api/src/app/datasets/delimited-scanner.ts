import { closeSync, openSync, readSync } from 'node:fs';
import { DatasetFormatError } from './dataset-format-error';

/**
 * One row's fields as byte ranges of `bytes`: field i is bytes[starts[i], ends[i]), quotes already
 * removed and doubled quotes undone. `count` is the row's number of fields, which may exceed the
 * capacity of `starts` for a ragged row (only the first fields are then recorded).
 */
export interface RowFields {
  bytes: Uint8Array;
  starts: Int32Array;
  ends: Int32Array;
  count: number;
  /** the line the row starts on, counted from the first line of the range */
  line: number;
}

/** Receives each complete row synchronously; answering true stops the scan after it, throwing stops it too. */
export type RowSink = (row: RowFields) => boolean | void;

/** A problem on a numbered line; the line is a number so a range read apart can be renumbered. */
export class LineError extends DatasetFormatError {
  constructor(
    readonly line: number,
    problem: string,
  ) {
    super(`line ${line}`, problem);
  }
}

export interface ScanRangeOptions {
  delimiter: number;
  /** byte offset of the first row */
  start: number;
  /** rows that start at or after this offset are left for the next range */
  end: number;
  /** fields recorded per row; a ragged row beyond this still has its fields counted */
  capacity: number;
}

export interface ScanRangeOutcome {
  /** where the scan stopped: just after the last row read (the next range must start here) */
  stoppedAt: number;
  /** line breaks passed from `start` to `stoppedAt` */
  lineBreaks: number;
}

const QUOTE = 0x22;
const LF = 0x0a;
const CR = 0x0d;
const CHUNK_BYTES = 1024 * 1024;
/** A row longer than this is not a table row (a file with no line breaks, or a quote never closed). */
const MAX_ROW_BYTES = 64 * 1024 * 1024;

/**
 * Reads the rows of a delimited text file that start in [start, end), by bytes, as RFC 4180
 * describes them (https://www.rfc-editor.org/rfc/rfc4180): quoted fields may hold the separator,
 * line breaks and doubled quotes; lines end in LF or CRLF; empty lines are skipped. The file is
 * read in chunks; a row cut by the end of a chunk is read again from its start once the next chunk
 * is in, so no field is ever copied. Strings are never made here: the sink sees bytes.
 */
export function scanDelimitedRange(path: string, options: ScanRangeOptions, sink: RowSink): ScanRangeOutcome {
  const { delimiter, end, capacity } = options;
  const starts = new Int32Array(capacity);
  const ends = new Int32Array(capacity);
  const escaped = new Uint8Array(capacity);
  const row: RowFields = { bytes: new Uint8Array(0), starts, ends, count: 0, line: 1 };
  const chunks = new ChunkReader(path, options.start);
  try {
    let bytes = chunks.bytes;
    let filled = 0; // bytes held in `bytes`
    let atEof = false;
    let line = 1;
    let rowStart = 0; // index in `bytes` of the row being read
    let nextQuote = -1; // index of the next quote at or after rowStart (filled when none); stale when below rowStart
    const plain: PlainRowsState = { at: 0, line: 1, stop: false };
    // Reading on is written out where it happens (not as a closure) so these locals stay in registers.
    chunks.refill(rowStart, filled, line);
    bytes = chunks.bytes;
    filled = chunks.filled;
    atEof = chunks.atEof;
    while (chunks.base + rowStart < end) {
      if (rowStart >= filled) {
        if (atEof) break;
        chunks.refill(rowStart, filled, line);
        bytes = chunks.bytes;
        filled = chunks.filled;
        atEof = chunks.atEof;
        rowStart = 0;
        nextQuote = -1;
        continue;
      }
      // Rows before the next quote need no quote handling: read them in a tight loop.
      if (nextQuote < rowStart) {
        const at = bytes.indexOf(QUOTE, rowStart);
        nextQuote = at === -1 || at >= filled ? filled : at;
      }
      if (nextQuote > rowStart) {
        plain.at = rowStart;
        plain.line = line;
        plainRows(bytes, nextQuote, end - chunks.base, delimiter, row, sink, plain);
        const moved = plain.at !== rowStart;
        rowStart = plain.at;
        line = plain.line;
        if (plain.stop) break;
        if (moved) continue;
      }
      // Read one row from rowStart; `complete` says whether it ended inside the bytes held.
      let i = rowStart;
      let count = 0;
      let fieldStart = i;
      let breaks = 0;
      let complete = false;
      let needMore = false;
      while (true) {
        if (i >= filled) {
          if (!atEof) {
            needMore = true;
            break;
          }
          // The last row of the file, without a final line break.
          if (count < capacity) {
            starts[count] = fieldStart;
            ends[count] = i > fieldStart && bytes[i - 1] === CR ? i - 1 : i;
            escaped[count] = 0;
          }
          count++;
          complete = true;
          break;
        }
        let b = bytes[i];
        if (b === QUOTE && i === fieldStart) {
          // A quoted field: find its closing quote, passing doubled quotes.
          let j = i + 1;
          let doubled = 0;
          let closed = -1;
          while (j < filled) {
            b = bytes[j];
            if (b === QUOTE) {
              if (j + 1 >= filled && !atEof) break;
              if (j + 1 < filled && bytes[j + 1] === QUOTE) {
                doubled = 1;
                j += 2;
                continue;
              }
              closed = j;
              break;
            }
            if (b === LF) breaks++;
            j++;
          }
          if (closed === -1) {
            if (!atEof || j < filled) {
              needMore = true;
              break;
            }
            throw new LineError(line, 'a quoted value is opened but never closed before the end of the file');
          }
          let after = closed + 1;
          if (after < filled && bytes[after] === CR && after + 1 < filled && bytes[after + 1] === LF) after++;
          else if (after < filled && bytes[after] === CR && after + 1 >= filled && !atEof) {
            needMore = true;
            break;
          }
          if (after < filled && bytes[after] !== delimiter && bytes[after] !== LF) {
            throw new LineError(line + breaks, 'a quoted value is followed by other characters; double a quote inside a quoted value ("")');
          }
          if (count < capacity) {
            starts[count] = i + 1;
            ends[count] = closed;
            escaped[count] = doubled;
          }
          count++;
          if (after >= filled) {
            if (!atEof) {
              needMore = true;
              break;
            }
            i = after;
            complete = true;
            break;
          }
          if (bytes[after] === LF) {
            breaks++;
            i = after + 1;
            complete = true;
            break;
          }
          i = after + 1;
          fieldStart = i;
          // A separator at the very end of the file ends the row with one more empty field.
          if (i >= filled && atEof) {
            if (count < capacity) {
              starts[count] = i;
              ends[count] = i;
              escaped[count] = 0;
            }
            count++;
            complete = true;
            break;
          }
          continue;
        }
        // An unquoted field: up to the separator or the line break.
        while (i < filled) {
          b = bytes[i];
          if (b === delimiter || b === LF) break;
          if (b === QUOTE) {
            throw new LineError(line, 'a quote appears inside a value that does not start with a quote; put the whole value in quotes and double the quote inside ("")');
          }
          i++;
        }
        if (i >= filled) continue; // handled at the top: end of bytes held or of the file
        if (count < capacity) {
          starts[count] = fieldStart;
          ends[count] = b === LF && i > fieldStart && bytes[i - 1] === CR ? i - 1 : i;
          escaped[count] = 0;
        }
        count++;
        i++;
        if (b === LF) {
          breaks++;
          complete = true;
          break;
        }
        fieldStart = i;
        if (i >= filled && atEof) {
          if (count < capacity) {
            starts[count] = i;
            ends[count] = i;
            escaped[count] = 0;
          }
          count++;
          complete = true;
          break;
        }
      }
      if (needMore) {
        chunks.refill(rowStart, filled, line);
        bytes = chunks.bytes;
        filled = chunks.filled;
        atEof = chunks.atEof;
        rowStart = 0;
        nextQuote = -1;
        continue;
      }
      if (!complete) break;
      const rowLine = line;
      line += breaks;
      const next = i;
      rowStart = next;
      // An empty line (one empty field) is no row.
      if (!(count === 1 && ends[0] === starts[0])) {
        for (let f = 0; f < count && f < capacity; f++) if (escaped[f]) ends[f] = undoDoubledQuotes(bytes, starts[f], ends[f]);
        row.bytes = bytes;
        row.count = count;
        row.line = rowLine;
        if (sink(row) === true) break;
      }
    }
    return { stoppedAt: chunks.base + rowStart, lineBreaks: line - 1 };
  } finally {
    chunks.close();
  }
}

/** The bytes of a file read in chunks, keeping an unfinished row at the front when reading on. */
class ChunkReader {
  bytes = new Uint8Array(CHUNK_BYTES);
  filled = 0;
  /** file offset of bytes[0] */
  base: number;
  atEof = false;
  private readonly fd: number;

  constructor(path: string, start: number) {
    this.fd = openSync(path, 'r');
    this.base = start;
  }

  /** Keeps bytes[keepFrom, filled), moves them to the front, and reads on after them. */
  refill(keepFrom: number, filled: number, line: number): void {
    const keep = filled - keepFrom;
    if (keepFrom > 0) this.bytes.copyWithin(0, keepFrom, filled);
    else if (keep === this.bytes.length) {
      if (this.bytes.length >= MAX_ROW_BYTES) throw new LineError(line, `a row is longer than ${MAX_ROW_BYTES / 1024 / 1024} MB; is a quoted value left open?`);
      const larger = new Uint8Array(this.bytes.length * 2);
      larger.set(this.bytes.subarray(0, keep));
      this.bytes = larger;
    }
    this.base += keepFrom;
    const read = readSync(this.fd, this.bytes, keep, this.bytes.length - keep, this.base + keep);
    if (read === 0) this.atEof = true;
    this.filled = keep + read;
  }

  close(): void {
    closeSync(this.fd);
  }
}

interface PlainRowsState {
  /** in: where to start; out: the start of the first row not read */
  at: number;
  line: number;
  /** the sink asked to stop */
  stop: boolean;
}

/**
 * Reads the rows that start before `endAt` and end (in a line break) before `quoteAt`, where no
 * quote can occur: one comparison per byte for the separator and one for the line break.
 */
function plainRows(bytes: Uint8Array, quoteAt: number, endAt: number, delimiter: number, row: RowFields, sink: RowSink, state: PlainRowsState): void {
  const { starts, ends } = row;
  const capacity = starts.length;
  let i = state.at;
  let line = state.line;
  while (i < endAt) {
    let count = 0;
    let fieldStart = i;
    let j = i;
    for (; j < quoteAt; j++) {
      const b = bytes[j];
      if (b === delimiter) {
        if (count < capacity) {
          starts[count] = fieldStart;
          ends[count] = j;
        }
        count++;
        fieldStart = j + 1;
      } else if (b === LF) break;
    }
    if (j >= quoteAt) break; // the row runs into a quote or past the bytes held
    const fieldEnd = j > fieldStart && bytes[j - 1] === CR ? j - 1 : j;
    if (count < capacity) {
      starts[count] = fieldStart;
      ends[count] = fieldEnd;
    }
    count++;
    const rowLine = line++;
    i = j + 1;
    if (count === 1 && fieldEnd === fieldStart) continue; // an empty line is no row
    row.bytes = bytes;
    row.count = count;
    row.line = rowLine;
    if (sink(row) === true) {
      state.stop = true;
      i = j + 1;
      break;
    }
  }
  state.at = i;
  state.line = line;
}

/** Turns each "" into " in place; answers the field's new end. */
function undoDoubledQuotes(bytes: Uint8Array, start: number, end: number): number {
  let to = start;
  for (let from = start; from < end; from++, to++) {
    bytes[to] = bytes[from];
    if (bytes[from] === QUOTE) from++;
  }
  return to;
}
