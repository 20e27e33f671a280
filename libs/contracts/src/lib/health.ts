import { z } from 'zod';

export const healthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  database: z.object({ reachable: z.boolean(), client: z.string() }),
  migrations: z.object({ current: z.boolean(), pending: z.array(z.string()) }),
  engineVersion: z.string(),
});
export type Health = z.infer<typeof healthSchema>;
