/**
 * Read category labels as the whole-number values of a counted quantity ("0", "1", …), check that
 * they form an unbroken run, and order them. Positions refer to the spec's input order.
 */
import { EngineInputError } from '../../spec/engine-input-error';

export interface CountedValue {
  value: number;
  count: number;
  /** position of the category in the spec */
  index: number;
}

const WHOLE_NUMBER = /^\s*-?\d+\s*$/;

export function readCountedValues(labels: readonly string[], counts: readonly number[], family: string): CountedValue[] {
  const values: CountedValue[] = labels.map((label, index) => {
    if (!WHOLE_NUMBER.test(label)) {
      throw EngineInputError.at(
        `observed.labels.${index}`,
        `for a ${family} fit each label must be a whole number (the counted value), got "${label}"`,
      );
    }
    return { value: Number(label), count: counts[index], index };
  });
  values.sort((a, b) => a.value - b.value);
  for (let i = 1; i < values.length; i++) {
    if (values[i].value === values[i - 1].value) {
      throw EngineInputError.at(`observed.labels.${values[i].index}`, `the value ${values[i].value} appears twice`);
    }
    if (values[i].value !== values[i - 1].value + 1) {
      throw EngineInputError.at(
        'observed.labels',
        `the values must be an unbroken run of whole numbers: ${values[i - 1].value + 1} is missing (add it with count 0)`,
      );
    }
  }
  return values;
}
