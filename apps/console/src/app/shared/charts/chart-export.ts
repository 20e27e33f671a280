/** Saving a chart drawn with ECharts' SVG renderer as an SVG file or as a PNG picture. */
import { saveFile } from '../../core/files/save-file';

export interface SvgChart {
  renderToSVGString(): string;
  getWidth(): number;
  getHeight(): number;
}

export function saveChartAsSvg(chart: SvgChart, fileName: string): void {
  saveFile(new Blob([chart.renderToSVGString()], { type: 'image/svg+xml' }), `${fileName}.svg`);
}

/** Draws the SVG onto a canvas at twice the size (sharp on high-density screens) and saves it as PNG. */
export async function saveChartAsPng(chart: SvgChart, fileName: string, background: string): Promise<void> {
  const width = chart.getWidth();
  const height = chart.getHeight();
  const scale = 2;
  const url = URL.createObjectURL(new Blob([chart.renderToSVGString()], { type: 'image/svg+xml' }));
  try {
    const image = new Image();
    image.width = width;
    image.height = height;
    await new Promise<void>((resolve, reject) => {
      image.onload = () => resolve();
      image.onerror = () => reject(new Error('The chart could not be drawn as a picture.'));
      image.src = url;
    });
    const canvas = document.createElement('canvas');
    canvas.width = width * scale;
    canvas.height = height * scale;
    const context = canvas.getContext('2d');
    if (!context) throw new Error('This browser cannot draw pictures.');
    context.fillStyle = background;
    context.fillRect(0, 0, canvas.width, canvas.height);
    context.drawImage(image, 0, 0, canvas.width, canvas.height);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (!blob) throw new Error('The chart could not be saved as a picture.');
    saveFile(blob, `${fileName}.png`);
  } finally {
    URL.revokeObjectURL(url);
  }
}
