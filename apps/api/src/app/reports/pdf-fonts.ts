import { existsSync } from 'node:fs';
import { join } from 'node:path';

/** A script the shipped Roboto files are split into; each has its own file per weight. */
type Script = 'latin' | 'latin-ext' | 'greek';
export type Weight = 400 | 700;

export interface PdfFonts {
  /** the registered font name for a script and weight, when its file was found */
  name(script: Script, weight: Weight): string | undefined;
  /** file paths to register with pdfkit, by name */
  files: Map<string, string>;
}

/**
 * Finds Roboto for PDF reports: the WOFF files shipped beside the console's fonts (fonts/roboto).
 * WOFF rather than the console's
 * WOFF2: fontkit 2.0.4 (pdfkit's font reader) fails to subset some WOFF2 glyphs, the colon among
 * them, while it subsets the same glyphs from WOFF. Greek is needed for χ² and α.
 */
export function findPdfFonts(fontsDir: string): PdfFonts {
  const folder = join(fontsDir, 'roboto');
  const files = new Map<string, string>();
  for (const script of ['latin', 'latin-ext', 'greek'] as const) {
    for (const weight of [400, 700] as const) {
      const fileName = `roboto-${script}-${weight}-normal.woff`;
      if (existsSync(join(folder, fileName))) files.set(`roboto-${script}-${weight}`, join(folder, fileName));
    }
  }
  if (!files.has('roboto-latin-400')) {
    throw new Error(`PDF reports need Roboto WOFF files (roboto-latin-400-normal.woff and its siblings) in ${folder}`);
  }
  return {
    files,
    name: (script, weight) => {
      const name = `roboto-${script}-${weight}`;
      if (files.has(name)) return name;
      const regular = `roboto-${script}-400`;
      return files.has(regular) ? regular : undefined;
    },
  };
}

/** Which shipped subset draws a character (the subsets' Unicode ranges, simplified to whole blocks). */
export function scriptOf(codePoint: number): Script {
  if (codePoint >= 0x370 && codePoint <= 0x3ff) return 'greek';
  if (
    (codePoint >= 0x100 && codePoint <= 0x2ff && codePoint !== 0x131 && codePoint !== 0x152 && codePoint !== 0x153) ||
    (codePoint >= 0x1d00 && codePoint <= 0x1eff) ||
    (codePoint >= 0x2c60 && codePoint <= 0x2c7f) ||
    (codePoint >= 0xa720 && codePoint <= 0xa7ff)
  ) {
    return 'latin-ext';
  }
  return 'latin';
}

/** Stand-ins for characters when the file that draws them is missing: χ² is also written X². */
const substitutes: Record<string, string> = { χ: 'X', α: 'alpha ', Χ: 'X' };

export interface TextRun {
  font: string;
  text: string;
}

/** Splits text into runs that one font file can draw each. */
export function textRuns(text: string, fonts: PdfFonts, weight: Weight): TextRun[] {
  const runs: TextRun[] = [];
  for (const char of text) {
    let font = fonts.name(scriptOf(char.codePointAt(0)!), weight);
    let piece = char;
    if (!font) {
      font = fonts.name('latin', weight)!;
      piece = substitutes[char] ?? '?';
    }
    const last = runs[runs.length - 1];
    if (last && last.font === font) last.text += piece;
    else runs.push({ font, text: piece });
  }
  return runs;
}
