import { extname } from 'node:path';

/** The kinds of file we read. Plain text tables are CSV (any common separator) or TSV. */
export type FileKind = 'csv' | 'tsv' | 'xlsx';

const kindByExtension: Record<string, FileKind> = {
  '.csv': 'csv',
  '.txt': 'csv',
  '.tsv': 'tsv',
  '.tab': 'tsv',
  '.xlsx': 'xlsx',
};

/** The kind a file name says it is, or undefined when we do not read that kind. */
export function fileKindOf(fileName: string): FileKind | undefined {
  return kindByExtension[extname(fileName).toLowerCase()];
}

export const readableExtensions = Object.keys(kindByExtension);
