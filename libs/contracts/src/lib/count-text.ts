/**
 * Counts as people write them: "1234", "1,234", "1.234", "1 234", "1'234", "1,234.00",
 * "1.234,00". One rule, used wherever a count arrives as text (pasted counts in the console, a
 * column of counts in an uploaded table), so both read the same text the same way.
 *
 * A point or a comma is a thousands separator when the text can only be read that way (it
 * appears twice, or it comes before the other mark, or three digits follow it and the decimal
 * reading would not be a whole number), and a decimal mark when it cannot be one. "1.000" and
 * "1,000" can be 1000 or 1 (with three decimals): they are ambiguous alone, and settled by the
 * other values of the same column when those show which way the mark is used.
 */

export type CountMark = ',' | '.';

export type CountReading =
  | { ok: true; value: number; /** the marks this value used, and as what */ uses: Partial<Record<CountMark | 'space' | 'apostrophe', 'thousands' | 'decimal'>> }
  | { ok: false; problem: 'ambiguous'; mark: CountMark; /** the value with the mark between thousands, and as a decimal mark */ readings: [number, number]; message: string }
  | { ok: false; problem: 'empty' | 'negative' | 'fraction' | 'not-a-number' | 'too-large'; message: string };

const SPACES = /[ \u00a0\u202f\u2009]/;
const markName: Record<CountMark, string> = { ',': 'comma', '.': 'point' };

const refuse = (problem: 'empty' | 'negative' | 'fraction' | 'not-a-number' | 'too-large', message: string): CountReading => ({ ok: false, problem, message });

function whole(digits: string, uses: Extract<CountReading, { ok: true }>['uses']): CountReading {
  const value = Number(digits);
  if (!Number.isSafeInteger(value)) return refuse('too-large', 'is too large to be a count');
  return { ok: true, value, uses };
}

/** Reads one count written as text (already trimmed of quotes); see the module comment for the rule. */
export function readCount(input: string): CountReading {
  const text = input.trim();
  if (text === '') return refuse('empty', 'is empty');
  if (/^[-−]\s*\d/.test(text)) return refuse('negative', 'is negative');
  if (/^\d+$/.test(text)) return whole(text, {});
  // Spaces (also no-break and thin spaces) or apostrophes between groups of three digits.
  if (/^\d{1,3}([ \u00a0\u202f\u2009]\d{3})+$/.test(text)) return whole(text.replace(new RegExp(SPACES, 'g'), ''), { space: 'thousands' });
  if (/^\d{1,3}('\d{3})+$/.test(text)) return whole(text.replace(/'/g, ''), { apostrophe: 'thousands' });
  if (!/^\d[\d.,]*$/.test(text)) return refuse('not-a-number', 'is not a number');

  const commas = text.split(',').length - 1;
  const points = text.split('.').length - 1;
  if (commas > 0 && points > 0) {
    // Both marks: the last one is the decimal mark, the other separates thousands.
    const decimal: CountMark = text.lastIndexOf(',') > text.lastIndexOf('.') ? ',' : '.';
    const thousands: CountMark = decimal === ',' ? '.' : ',';
    const [integer, fraction, extra] = text.split(decimal);
    if (extra !== undefined || !groupedBy(integer, thousands)) return refuse('not-a-number', 'is not a number');
    if (!/^0*$/.test(fraction)) return refuse('fraction', 'is not a whole number');
    return whole(integer.split(thousands).join(''), { [thousands]: 'thousands', [decimal]: 'decimal' });
  }
  const mark: CountMark = commas > 0 ? ',' : '.';
  if (commas + points > 1) {
    // A mark used twice can only separate thousands.
    return groupedBy(text, mark) ? whole(text.split(mark).join(''), { [mark]: 'thousands' }) : refuse('not-a-number', 'is not a number');
  }
  const [integer, fraction] = text.split(mark);
  const decimalWhole = /^0*$/.test(fraction);
  if (fraction.length === 3 && groupedBy(text, mark)) {
    const grouped = Number(integer + fraction);
    if (!decimalWhole || grouped === Number(integer)) return whole(integer + fraction, { [mark]: 'thousands' });
    return {
      ok: false,
      problem: 'ambiguous',
      mark,
      readings: [grouped, Number(integer)],
      message: `is ambiguous: ${grouped} with the ${markName[mark]} between thousands, or ${Number(integer)} with the ${markName[mark]} as a decimal mark; write ${grouped} or ${Number(integer)}`,
    };
  }
  if (!decimalWhole) return refuse('fraction', 'is not a whole number');
  return whole(integer, fraction === '' ? {} : { [mark]: 'decimal' });
}

/** "1,234,567" by `mark`: one to three digits, then groups of three. */
function groupedBy(text: string, mark: CountMark): boolean {
  const groups = text.split(mark);
  return /^\d{1,3}$/.test(groups[0]) && !/^0\d/.test(groups[0]) && groups.slice(1).every((group) => /^\d{3}$/.test(group));
}

export interface CountColumnReading {
  /** each text's count, or undefined where it could not be read */
  values: Array<number | undefined>;
  /** for each text that could not be read: its position and what is wrong ("is negative", "is ambiguous: …") */
  problems: Array<{ index: number; problem: Exclude<CountReading, { ok: true }>['problem']; message: string }>;
  /** how the marks were read, in plain words, when any value used one (shown to the person) */
  decisions: string[];
}

/**
 * Reads a column of counts with one convention for the whole column: a mark read one way in one
 * value settles the ambiguous values; a mark read both ways is reported on the values that depend on it.
 */
export function readCountColumn(texts: readonly string[]): CountColumnReading {
  const readings = texts.map(readCount);
  const seen: Record<CountMark, Set<'thousands' | 'decimal'>> = { ',': new Set(), '.': new Set() };
  const examples: Partial<Record<string, string>> = {};
  readings.forEach((reading, i) => {
    if (!reading.ok) return;
    for (const mark of [',', '.'] as const) {
      const use = reading.uses[mark];
      if (use) {
        seen[mark].add(use);
        examples[`${mark}${use}`] ??= texts[i].trim();
      }
    }
  });
  const conflicted = (mark: CountMark) => seen[mark].size > 1;
  const values: Array<number | undefined> = [];
  const problems: CountColumnReading['problems'] = [];
  readings.forEach((reading, index) => {
    if (reading.ok) {
      const clash = ([',', '.'] as const).find((mark) => reading.uses[mark] && conflicted(mark));
      if (clash) {
        values.push(undefined);
        problems.push({
          index,
          problem: 'ambiguous',
          message: `is ambiguous: the ${markName[clash]} separates thousands in "${examples[`${clash}thousands`]}" but is a decimal mark in "${examples[`${clash}decimal`]}"; use one convention`,
        });
        return;
      }
      values.push(reading.value);
      return;
    }
    if (reading.problem === 'ambiguous' && seen[reading.mark].size === 1) {
      const use = [...seen[reading.mark]][0];
      values.push(use === 'thousands' ? reading.readings[0] : reading.readings[1]);
      return;
    }
    values.push(undefined);
    problems.push({ index, problem: reading.problem, message: reading.message });
  });
  const decisions: string[] = [];
  for (const mark of [',', '.'] as const) {
    if (seen[mark].size !== 1) continue;
    const use = [...seen[mark]][0];
    decisions.push(
      use === 'thousands'
        ? `The ${markName[mark]} was read as a thousands separator (“${examples[`${mark}thousands`]}” is ${readCountAs(examples[`${mark}thousands`]!)}).`
        : `The ${markName[mark]} was read as a decimal mark (“${examples[`${mark}decimal`]}” is ${readCountAs(examples[`${mark}decimal`]!)}).`,
    );
  }
  if (readings.some((reading) => reading.ok && (reading.uses.space || reading.uses.apostrophe))) {
    decisions.push('Spaces or apostrophes between groups of three digits were read as thousands separators.');
  }
  return { values, problems, decisions };
}

const readCountAs = (text: string): string => {
  const reading = readCount(text);
  return reading.ok ? String(reading.value) : text;
};
