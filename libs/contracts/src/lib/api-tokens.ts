import { z } from 'zod';

export const createApiTokenRequestSchema = z.object({
  name: z.string().trim().min(1, { message: 'name must not be empty' }).max(100, { message: 'name must be at most 100 characters' }),
});
export type CreateApiTokenRequest = z.infer<typeof createApiTokenRequestSchema>;

/** A personal API token as listed: never the secret itself, only its first characters. */
export const apiTokenSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  hint: z.string().describe('the first characters of the token'),
  owner: z.object({ id: z.number().int(), name: z.string() }),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
});
export type ApiToken = z.infer<typeof apiTokenSchema>;

/** The answer to creating a token: the only time its secret is shown. */
export const createdApiTokenSchema = apiTokenSchema.extend({ token: z.string().describe('tf_… — shown once; store it now') });
export type CreatedApiToken = z.infer<typeof createdApiTokenSchema>;
