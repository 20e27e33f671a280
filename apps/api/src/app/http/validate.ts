import type { z } from 'zod';
import { badRequest } from './http-error';

/** Parses input with a shared schema; a failure names every offending field. */
export function parseInput<Schema extends z.ZodType>(schema: Schema, input: unknown, what: string): z.infer<Schema> {
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  const fields = parsed.error.issues.map((issue) => ({
    path: issue.path.map(String).join('.') || '(root)',
    message: issue.message,
  }));
  const summary = fields.map((field) => `${field.path}: ${field.message}`).join('; ');
  throw badRequest(`invalid ${what}: ${summary}`, fields);
}
