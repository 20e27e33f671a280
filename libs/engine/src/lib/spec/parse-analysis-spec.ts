import { analysisSpecSchema, type AnalysisSpec } from './analysis-spec';
import { EngineInputError } from './engine-input-error';

/** Validate an unknown value as an AnalysisSpec, throwing EngineInputError listing every problem. */
export function parseAnalysisSpec(input: unknown): AnalysisSpec {
  const parsed = analysisSpecSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw new EngineInputError(
    parsed.error.issues.map((issue) => ({
      path: issue.path.map(String).join('.'),
      message: issue.message,
    })),
  );
}
