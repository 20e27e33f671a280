import { ByteLabels } from './byte-labels';
import { cellText, type TextEncoding } from './cell-text';

/** `LabelIndex.of` answers this for a cell with no text (only white space). */
export const BLANK = -1;
/** `LabelIndex.of` answers this when a new label would pass the limit. */
export const TOO_MANY = -2;

/**
 * Numbers the different labels of one column in order of first appearance. A label is the cell's
 * trimmed text; cells are told apart by their bytes first, and text is made once per different
 * byte sequence, so a column of ten million cells with five values makes five strings.
 */
export class LabelIndex {
  readonly labels: string[] = [];
  /** the line each label was first seen on */
  readonly firstLines: number[] = [];
  private readonly raw = new ByteLabels();
  private readonly labelOfRaw: number[] = [];
  private readonly byText = new Map<string, number>();

  /**
   * @param maxLabels more different labels than this answer TOO_MANY
   * @param maxVariants more different byte sequences than this (white space around the same labels) answer TOO_MANY too
   */
  constructor(
    private readonly encoding: TextEncoding,
    private readonly maxLabels: number,
    private readonly maxVariants = maxLabels * 8,
  ) {}

  of(bytes: Uint8Array, start: number, end: number, line: number): number {
    const raw = this.raw.find(bytes, start, end);
    if (raw !== -1) return this.labelOfRaw[raw];
    if (this.raw.size >= this.maxVariants) return TOO_MANY;
    const text = cellText(bytes, start, end, this.encoding);
    let label = BLANK;
    if (text !== '') {
      const known = this.byText.get(text);
      if (known !== undefined) label = known;
      else {
        if (this.labels.length >= this.maxLabels) return TOO_MANY;
        label = this.labels.length;
        this.labels.push(text);
        this.firstLines.push(line);
        this.byText.set(text, label);
      }
    }
    this.labelOfRaw[this.raw.add(bytes, start, end)] = label;
    return label;
  }
}
