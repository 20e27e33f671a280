/**
 * A number for a table cell: whole numbers with thousands separators, others to `digits`
 * significant digits, very small values in scientific notation, and a true minus sign.
 */
export function formatNumber(value: number, digits: number): string {
  if (!Number.isFinite(value)) return '—';
  const text =
    Number.isInteger(value) && Math.abs(value) < 1e15
      ? value.toLocaleString('en-US')
      : value !== 0 && Math.abs(value) < 1e-4
        ? value.toExponential(Math.max(0, digits - 1))
        : Number(value.toPrecision(digits)).toLocaleString('en-US', { maximumFractionDigits: 12 });
  return text.replace(/^-/, '−');
}
