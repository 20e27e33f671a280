/**
 * The period an uploaded file's batch covers, as the form's `datetime-local` fields hold it (the
 * person's own clock): by default from where the previous batch ended, or the day before, up to now.
 */

/** A date as a `datetime-local` value in the person's own time zone, to the minute. */
export function localInputValue(date: Date): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}`;
}

export function defaultUploadPeriod(lastPeriodEnd: string | null, now: Date): { start: string; end: string } {
  const start = lastPeriodEnd ? new Date(lastPeriodEnd) : new Date(now.getTime() - 86_400_000);
  return { start: localInputValue(start), end: localInputValue(now) };
}

/** The form's period as the API's ISO date-times, or what is wrong with it. */
export function periodFromInputs(start: string, end: string): { ok: true; periodStart: string; periodEnd: string } | { ok: false; error: string } {
  const from = new Date(start);
  const to = new Date(end);
  if (!start || Number.isNaN(from.getTime())) return { ok: false, error: 'Give the start of the period the file covers.' };
  if (!end || Number.isNaN(to.getTime())) return { ok: false, error: 'Give the end of the period the file covers.' };
  if (from > to) return { ok: false, error: 'The period must not end before it starts.' };
  return { ok: true, periodStart: from.toISOString(), periodEnd: to.toISOString() };
}
