import { z } from 'zod';
import { analysisSpecSchema } from '@tallyfit/engine';
import { anyRole, type RouteDefinition } from '../http/route-table';
import { parseInput } from '../http/validate';
import type { EngineRunner } from './engine-runner';

export function engineRoutes(engine: EngineRunner): RouteDefinition[] {
  return [
    {
      method: 'post',
      path: '/engine/analyze',
      access: anyRole,
      summary: 'Run the engine on a spec and return the result; nothing is stored (for pipelines, with an API token)',
      request: { body: analysisSpecSchema },
      responses: { 200: z.record(z.string(), z.unknown()).describe("the engine's AnalysisResult") },
      handler: async (req, res) => {
        const spec = parseInput(analysisSpecSchema, req.body, 'spec');
        res.json(await engine.analyze(spec));
      },
    },
  ];
}
