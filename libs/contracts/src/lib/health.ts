import { z } from 'zod';

export const healthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  database: z.object({ reachable: z.boolean(), client: z.string() }),
  migrations: z.object({ current: z.boolean(), pending: z.array(z.string()) }),
  /** Whether writes work: false after a write failed for lack of disk space (until one succeeds) or when the disk is nearly full. */
  storage: z.object({
    writable: z.boolean(),
    freeBytes: z.number().nullable(),
    problem: z.string().optional(),
  }),
  engineVersion: z.string(),
});
export type Health = z.infer<typeof healthSchema>;
