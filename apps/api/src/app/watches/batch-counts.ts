import type { FieldProblem } from '../http/http-error';
import { unprocessable } from '../http/http-error';

const quoted = (labels: string[]) => labels.map((label) => JSON.stringify(label)).join(', ');

/**
 * A batch's counts in the watch's category order. Categories the watch does not have are refused
 * by name (a renamed variant must not be dropped silently), and so are the watch's categories a
 * pushed batch leaves out. A pulled batch comes from GROUP BY, where an absent row means none were
 * seen, so there missing categories count 0.
 */
export function countsInWatchOrder(labels: string[], counts: Record<string, number>, missing: 'refuse' | 'zero'): number[] {
  const known = new Set(labels);
  const unknown = Object.keys(counts).filter((label) => !known.has(label));
  const absent = missing === 'refuse' ? labels.filter((label) => !Object.hasOwn(counts, label)) : [];
  if (unknown.length || absent.length) {
    const fields: FieldProblem[] = [
      ...unknown.map((label) => ({ path: `counts.${label}`, message: 'not a category of this watch' })),
      ...absent.map((label) => ({ path: `counts.${label}`, message: 'missing: send 0 when none were seen' })),
    ];
    const parts = [
      ...(unknown.length ? [`categories this watch does not have: ${quoted(unknown)}`] : []),
      ...(absent.length ? [`no count for ${quoted(absent)} (send 0 when none were seen)`] : []),
    ];
    throw unprocessable(`the batch does not match the watch's categories (${quoted(labels)}): ${parts.join('; ')}`, fields);
  }
  return labels.map((label) => counts[label] ?? 0);
}
