import { MUTED, type PdfText } from './pdf-text';

export interface ChartCategory {
  label: string;
  observed: number;
  expected: number;
}

const OBSERVED_COLOUR = '#1b6f8a';
const EXPECTED_COLOUR = '#e3a33b';

/** Tick spacing of 1, 2 or 5 times a power of ten giving about `target` ticks up to `max`. */
export function niceStep(max: number, target = 5): number {
  if (max <= 0) return 1;
  const raw = max / target;
  const power = 10 ** Math.floor(Math.log10(raw));
  const multiple = [1, 2, 5, 10].find((m) => m * power >= raw) ?? 10;
  return multiple * power;
}

const tickLabel = (value: number) => (Number.isInteger(value) ? value.toLocaleString('en-US') : value.toPrecision(3));

/**
 * Observed beside expected counts per category, drawn with vector paths (bars, axis, grid lines)
 * so the chart stays sharp at any zoom and adds no image to the file.
 */
export function drawObservedExpectedChart(text: PdfText, categories: ChartCategory[], height = 190): void {
  const { doc } = text;
  text.ensureRoom(height + 40);
  const top = doc.y + 18;
  const axisWidth = 40;
  const labelHeight = 16;
  const plotLeft = text.left + axisWidth;
  const plotWidth = text.contentWidth - axisWidth;
  const plotHeight = height - labelHeight - 18;
  const bottom = top + plotHeight;

  drawLegend(text, top - 16);

  const max = Math.max(1, ...categories.flatMap((category) => [category.observed, category.expected]));
  const step = niceStep(max);
  const ceiling = Math.ceil(max / step) * step;
  const yOf = (value: number) => bottom - (value / ceiling) * plotHeight;

  for (let value = 0; value <= ceiling + step / 2; value += step) {
    const y = yOf(value);
    doc.moveTo(plotLeft, y).lineTo(plotLeft + plotWidth, y).lineWidth(0.3).strokeColor(value === 0 ? '#5b6770' : '#d8dee2').stroke();
    text.cell(tickLabel(value), text.left, y - 4, axisWidth - 6, 'right', { size: 7, color: MUTED });
  }

  const groupWidth = plotWidth / categories.length;
  const barWidth = Math.max(0.5, Math.min(18, groupWidth * 0.36));
  // With many categories, label every n-th so labels do not overlap.
  const labelEvery = Math.max(1, Math.ceil(categories.length / Math.max(1, Math.floor(plotWidth / 36))));
  categories.forEach((category, i) => {
    const centre = plotLeft + groupWidth * (i + 0.5);
    doc.rect(centre - barWidth, yOf(category.observed), barWidth, bottom - yOf(category.observed)).fill(OBSERVED_COLOUR);
    doc.rect(centre, yOf(category.expected), barWidth, bottom - yOf(category.expected)).fill(EXPECTED_COLOUR);
    if (i % labelEvery === 0) {
      const width = groupWidth * labelEvery - 2;
      text.cell(category.label, centre - width / 2, bottom + 4, width, 'center', { size: 7, color: MUTED });
    }
  });
  doc.x = text.left;
  doc.y = bottom + labelHeight + 8;
}

function drawLegend(text: PdfText, y: number): void {
  const { doc } = text;
  let x = text.left + text.contentWidth - 150;
  for (const [label, colour] of [
    ['Observed', OBSERVED_COLOUR],
    ['Expected', EXPECTED_COLOUR],
  ] as const) {
    doc.rect(x, y + 1, 8, 8).fill(colour);
    text.cell(label, x + 12, y, 60, 'left', { size: 8, color: MUTED });
    x += 75;
  }
}
