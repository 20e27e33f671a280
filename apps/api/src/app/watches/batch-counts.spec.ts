import { HttpError } from '../http/http-error';
import { countsInWatchOrder } from './batch-counts';

describe('countsInWatchOrder', () => {
  const labels = ['blue', 'green', 'orange'];

  it('puts the counts in the watch order', () => {
    expect(countsInWatchOrder(labels, { orange: 3, blue: 1, green: 2 }, 'refuse')).toEqual([1, 2, 3]);
  });

  it('names unknown and missing categories in one 422', () => {
    let caught: unknown;
    try {
      countsInWatchOrder(labels, { blue: 1, teal: 2, Green: 3 }, 'refuse');
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(HttpError);
    const error = caught as HttpError;
    expect(error.status).toBe(422);
    expect(error.message).toContain('categories this watch does not have: "teal", "Green"');
    expect(error.message).toContain('no count for "green", "orange"');
    expect(error.fields?.map((field) => field.path)).toEqual(['counts.teal', 'counts.Green', 'counts.green', 'counts.orange']);
  });

  it('counts absent categories as 0 for pulled batches, and still refuses unknown ones', () => {
    expect(countsInWatchOrder(labels, { green: 5 }, 'zero')).toEqual([0, 5, 0]);
    expect(() => countsInWatchOrder(labels, { purple: 5 }, 'zero')).toThrow(/"purple"/);
  });
});
