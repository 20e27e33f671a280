import { open } from 'node:fs/promises';
import { DatasetFormatError } from './dataset-format-error';
import type { FileKind } from './file-kind';

export interface TextLayout {
  encoding: 'utf8' | 'latin1';
  delimiter: string;
}

const SNIFF_BYTES = 64 * 1024;
const candidateDelimiters = [',', ';', '\t', '|'] as const;
const delimiterNames: Record<string, string> = { ',': 'commas', ';': 'semicolons', '\t': 'tabs', '|': 'vertical bars' };

export const delimiterName = (delimiter: string) => delimiterNames[delimiter] ?? JSON.stringify(delimiter);

/**
 * Looks at the start of a text table: refuses files that are not text (a spreadsheet or an image
 * renamed .csv), picks the encoding (UTF-8, else Latin-1 as older spreadsheet exports write) and
 * the separator the header line uses.
 */
export async function sniffTextLayout(path: string, kind: Exclude<FileKind, 'xlsx'>): Promise<TextLayout> {
  const head = await readHead(path);
  if (head.length === 0) throw new DatasetFormatError('line 1', 'the file is empty');
  refuseBinary(head);
  const encoding = isUtf8(head) ? 'utf8' : 'latin1';
  const headerLine = firstNonEmptyLine(head.toString(encoding).replace(/^\uFEFF/, ''));
  if (headerLine === undefined) throw new DatasetFormatError('line 1', 'the file holds only empty lines');
  return { encoding, delimiter: pickDelimiter(headerLine, kind) };
}

async function readHead(path: string): Promise<Buffer> {
  const handle = await open(path, 'r');
  try {
    const buffer = Buffer.alloc(SNIFF_BYTES);
    const { bytesRead } = await handle.read(buffer, 0, SNIFF_BYTES, 0);
    return buffer.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

/** Text tables hold no NUL bytes and few control characters; zip archives, images and executables do. */
function refuseBinary(head: Buffer): void {
  if (head.subarray(0, 4).equals(Buffer.from([0x50, 0x4b, 0x03, 0x04]))) {
    throw new DatasetFormatError('line 1', 'this is not a text file but a zip archive (an XLSX workbook perhaps); upload it with the .xlsx extension');
  }
  let controls = 0;
  for (let i = 0; i < head.length; i++) {
    const byte = head[i];
    if (byte === 0) {
      throw new DatasetFormatError(`line ${lineOfOffset(head, i)}`, 'the file holds binary data (a zero byte), not text; is it really a CSV or TSV file?');
    }
    if (byte < 0x20 && byte !== 0x09 && byte !== 0x0a && byte !== 0x0d && byte !== 0x0c) controls++;
  }
  if (controls > head.length / 100) {
    throw new DatasetFormatError('line 1', 'the file holds binary data (many control characters), not text; is it really a CSV or TSV file?');
  }
}

function lineOfOffset(buffer: Buffer, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset; i++) if (buffer[i] === 0x0a) line++;
  return line;
}

function isUtf8(head: Buffer): boolean {
  // The sniffed block may end in the middle of a character; only the last 3 bytes may be cut.
  const decoder = new TextDecoder('utf-8', { fatal: true });
  for (const cut of [0, 1, 2, 3]) {
    try {
      decoder.decode(head.subarray(0, head.length - cut));
      return true;
    } catch {
      if (head.length < SNIFF_BYTES) return false;
    }
  }
  return false;
}

function firstNonEmptyLine(text: string): string | undefined {
  return text.split(/\r\n|\n|\r/).find((line) => line.trim() !== '');
}

/** Counts each candidate separator outside quoted fields. */
function separatorCounts(line: string): Map<string, number> {
  const counts = new Map<string, number>();
  let quoted = false;
  for (const char of line) {
    if (char === '"') quoted = !quoted;
    else if (!quoted && (candidateDelimiters as readonly string[]).includes(char)) counts.set(char, (counts.get(char) ?? 0) + 1);
  }
  return counts;
}

function pickDelimiter(headerLine: string, kind: 'csv' | 'tsv'): string {
  const counts = separatorCounts(headerLine);
  if (kind === 'tsv') {
    if (counts.has('\t') || counts.size === 0) return '\t';
    const seen = [...counts.keys()].map(delimiterName).join(' and ');
    throw new DatasetFormatError(
      'line 1',
      `a TSV file separates its columns with tabs, but this header has none and uses ${seen}; save it as .csv or separate the columns with tabs`,
    );
  }
  let best = ',';
  let bestCount = 0;
  for (const delimiter of candidateDelimiters) {
    const count = counts.get(delimiter) ?? 0;
    if (count > bestCount) {
      best = delimiter;
      bestCount = count;
    }
  }
  return best;
}
