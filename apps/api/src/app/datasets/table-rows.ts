import { readDelimitedRows } from './delimited-rows';
import type { FileKind } from './file-kind';
import type { RowVisitor } from './table-row';
import { sniffTextLayout } from './text-sniff';
import { readXlsxRows } from './xlsx-rows';

/** Streams the rows of an uploaded file of any kind we read to `visit`, the header first. */
export async function readTableRows(path: string, kind: FileKind, visit: RowVisitor): Promise<void> {
  if (kind === 'xlsx') return readXlsxRows(path, visit);
  const layout = await sniffTextLayout(path, kind);
  return readDelimitedRows(path, layout, visit);
}
