import { MUTED, type PdfText } from './pdf-text';

export interface TableColumn {
  title: string;
  /** share of the content width */
  share: number;
  align?: 'left' | 'right';
}

const ROW_HEIGHT = 15;
const SIZE = 8.5;

/** A plain table: a bold header row with a rule under it, then rows; the header repeats after a page break. */
export function drawTable(text: PdfText, columns: TableColumn[], rows: string[][]): void {
  const { doc } = text;
  const total = columns.reduce((sum, column) => sum + column.share, 0);
  const widths = columns.map((column) => (column.share / total) * text.contentWidth);
  const padding = 4;

  const styleOf = (header: boolean) => ({ size: SIZE, weight: header ? (700 as const) : (400 as const), color: header ? MUTED : undefined });
  // A cell too long for its column wraps onto more lines (a "How computed" sentence) rather than being cut.
  const heightOf = (cells: string[], header: boolean) =>
    Math.max(ROW_HEIGHT, ...cells.map((cell, i) => text.heightOf(cell, widths[i] - 2 * padding, styleOf(header)) + 5));

  const drawRow = (cells: string[], header: boolean) => {
    const y = doc.y;
    const height = heightOf(cells, header);
    let x = text.left;
    cells.forEach((cell, i) => {
      text.wrapped(cell, x + padding, y + 3, widths[i] - 2 * padding, columns[i].align ?? 'left', styleOf(header));
      x += widths[i];
    });
    doc.y = y + height;
    doc
      .moveTo(text.left, doc.y)
      .lineTo(text.left + text.contentWidth, doc.y)
      .lineWidth(header ? 0.8 : 0.3)
      .strokeColor(header ? '#5b6770' : '#c9d1d6')
      .stroke();
  };

  text.ensureRoom(ROW_HEIGHT * 3);
  drawRow(columns.map((column) => column.title), true);
  for (const row of rows) {
    if (text.roomLeft < heightOf(row, false)) {
      doc.addPage();
      drawRow(columns.map((column) => column.title), true);
    }
    drawRow(row, false);
  }
  doc.x = text.left;
  doc.moveDown(0.5);
}
