import type { z } from 'zod';
import { badRequest, type FieldProblem } from './http-error';

type Issue = z.core.$ZodIssue;

/**
 * How far an alternative of a union was from matching. Keys it does not know weigh a little more
 * than a wrong field: the alternative that knows the keys that were sent is the one meant.
 */
const distance = (issues: readonly Issue[]) => issues.reduce((sum, issue) => sum + (issue.code === 'unrecognized_keys' ? 1.5 : 1), 0);

/**
 * The issues to report. A union that matched no alternative (one request body with two shapes)
 * reports the alternative that came closest, so the message names real fields rather than
 * "invalid input".
 */
function reportable(issues: readonly Issue[], prefix: PropertyKey[] = []): FieldProblem[] {
  return issues.flatMap((issue) => {
    const path = [...prefix, ...issue.path];
    if (issue.code === 'invalid_union' && issue.errors.length > 0) {
      const closest = issue.errors.reduce((best, candidate) => (distance(candidate) < distance(best) ? candidate : best));
      if (closest.length > 0) return reportable(closest, path);
    }
    return [{ path: path.map(String).join('.') || '(root)', message: issue.message }];
  });
}

/** Parses input with a shared schema; a failure names every offending field. */
export function parseInput<Schema extends z.ZodType>(schema: Schema, input: unknown, what: string): z.infer<Schema> {
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  const fields = reportable(parsed.error.issues);
  const summary = fields.map((field) => `${field.path}: ${field.message}`).join('; ');
  throw badRequest(`invalid ${what}: ${summary}`, fields);
}
