import type { z } from 'zod';
import { EngineInputError } from './engine-input-error';

/**
 * Validate an unknown value with a zod schema, throwing EngineInputError listing every problem
 * with its dotted path (prefixed with `pathPrefix`, e.g. `state`, when the value is one argument
 * among several).
 */
export function parseWithSchema<T>(schema: z.ZodType<T>, input: unknown, pathPrefix = ''): T {
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw new EngineInputError(
    parsed.error.issues.map((issue) => ({
      path: [...(pathPrefix ? [pathPrefix] : []), ...issue.path.map(String)].join('.'),
      message: issue.message,
    })),
  );
}
