import { analysisSpecSchema, type AnalysisSpec } from './analysis-spec';
import { parseWithSchema } from './parse-with-schema';

/** Validate an unknown value as an AnalysisSpec, throwing EngineInputError listing every problem. */
export function parseAnalysisSpec(input: unknown): AnalysisSpec {
  return parseWithSchema(analysisSpecSchema, input);
}
