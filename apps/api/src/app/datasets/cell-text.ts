// The rule's own entry point, so the scan worker does not load every schema of the contracts.
import { readCount } from '@tallyfit/contracts/count-text';

/** What a text table's bytes are written in (the sniffer decides). */
export type TextEncoding = 'utf8' | 'latin1';

/** A cell's bytes as text, untouched. */
export function cellString(bytes: Uint8Array, start: number, end: number, encoding: TextEncoding): string {
  return Buffer.from(bytes.buffer, bytes.byteOffset + start, end - start).toString(encoding);
}

/** A cell's bytes as the trimmed text a person reads. */
export function cellText(bytes: Uint8Array, start: number, end: number, encoding: TextEncoding): string {
  return cellString(bytes, start, end, encoding).trim();
}

/** The cell holds only white space (checked by bytes; text beyond ASCII is decoded and trimmed as JavaScript trims). */
export function isBlankCell(bytes: Uint8Array, start: number, end: number, encoding: TextEncoding): boolean {
  let beyondAscii = false;
  for (let i = start; i < end; i++) {
    const b = bytes[i];
    if (b === 0x20 || (b >= 0x09 && b <= 0x0d)) continue;
    if (b < 0x80) return false;
    beyondAscii = true;
  }
  return !beyondAscii || cellText(bytes, start, end, encoding) === '';
}

/**
 * The cell holds a count by `readCount`'s rule (an ambiguous "1,000" is a whole number either way).
 * Plain digits are recognised by bytes; anything else is decoded and given to `readCount`, so the
 * rule stays written once.
 */
export function isCountCell(bytes: Uint8Array, start: number, end: number, encoding: TextEncoding): boolean {
  const length = end - start;
  if (length > 0 && length <= 15) {
    let digits = true;
    for (let i = start; i < end; i++) {
      const b = bytes[i];
      if (b < 0x30 || b > 0x39) {
        digits = false;
        break;
      }
    }
    if (digits) return true;
  }
  const reading = readCount(cellText(bytes, start, end, encoding));
  return reading.ok || reading.problem === 'ambiguous';
}
