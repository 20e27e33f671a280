import { defaultUploadPeriod, localInputValue, periodFromInputs } from './upload-period';

describe('the period of an uploaded batch', () => {
  const now = new Date(2026, 11, 2, 14, 5, 30);

  it('starts where the previous batch ended, or a day before now', () => {
    const previousEnd = new Date(2026, 11, 1, 23, 0).toISOString();
    expect(defaultUploadPeriod(previousEnd, now)).toEqual({ start: '2026-12-01T23:00', end: '2026-12-02T14:05' });
    expect(defaultUploadPeriod(null, now)).toEqual({ start: '2026-12-01T14:05', end: '2026-12-02T14:05' });
  });

  it('turns the fields into the API’s date-times and refuses a period that runs backwards', () => {
    expect(periodFromInputs(localInputValue(new Date(2026, 11, 1, 8, 0)), localInputValue(now))).toEqual({
      ok: true,
      periodStart: new Date(2026, 11, 1, 8, 0).toISOString(),
      periodEnd: new Date(2026, 11, 2, 14, 5).toISOString(),
    });
    expect(periodFromInputs('2026-12-02T10:00', '2026-12-02T09:00')).toEqual({ ok: false, error: 'The period must not end before it starts.' });
    expect(periodFromInputs('', '2026-12-02T09:00')).toEqual({ ok: false, error: 'Give the start of the period the file covers.' });
  });
});
