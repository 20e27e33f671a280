import { z } from 'zod';
import { roleSchema } from './roles';

export const loginRequestSchema = z.object({
  email: z.email({ message: 'email must be an e-mail address' }).max(254),
  password: z.string().min(1, { message: 'password is required' }).max(200),
});
export type LoginRequest = z.infer<typeof loginRequestSchema>;

export const userSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
});
export type User = z.infer<typeof userSchema>;

export const loginResponseSchema = z.object({
  accessToken: z.string(),
  expiresIn: z.number().int().describe('seconds until the access token expires'),
  refreshToken: z.string().describe('exchange it at /auth/refresh for a new pair; each is used once'),
  user: userSchema,
});
export type LoginResponse = z.infer<typeof loginResponseSchema>;

export const refreshRequestSchema = z.object({
  refreshToken: z.string().min(1, { message: 'refreshToken is required' }).max(200),
});
export type RefreshRequest = z.infer<typeof refreshRequestSchema>;
