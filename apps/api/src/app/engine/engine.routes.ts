import { z } from 'zod';
import { analysisSpecSchema } from '@tallyfit/engine';
import { defineRoute, type RouteDefinition } from '../http/route-table';
import type { EngineRunner } from './engine-runner';

export function engineRoutes(engine: EngineRunner): RouteDefinition[] {
  return [
    defineRoute({
      method: 'post',
      path: '/engine/analyze',
      access: 'engine.compute',
      summary: 'Run the engine on a spec and return the result; nothing is stored (for pipelines, with an API token)',
      request: { body: analysisSpecSchema },
      responses: { 200: z.record(z.string(), z.unknown()).describe("the engine's AnalysisResult") },
      handler: async ({ body, user, res }) => {
        res.json(await engine.analyze(body, { owner: String(user.id) }));
      },
    }),
  ];
}
