import { z } from 'zod';
import { roleSchema } from './roles';

const password = z
  .string()
  .min(10, { message: 'password must be at least 10 characters' })
  .max(200, { message: 'password must be at most 200 characters' });
const personName = z.string().trim().min(1, { message: 'name must not be empty' }).max(200, { message: 'name must be at most 200 characters' });

export const personSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  disabled: z.boolean(),
  createdAt: z.string(),
});
export type Person = z.infer<typeof personSchema>;

export const createPersonRequestSchema = z.object({
  email: z.email({ message: 'email must be an e-mail address' }).max(254),
  name: personName,
  role: roleSchema,
  password,
});
export type CreatePersonRequest = z.infer<typeof createPersonRequestSchema>;

export const updatePersonRequestSchema = z
  .object({ name: personName.optional(), role: roleSchema.optional(), disabled: z.boolean().optional() })
  .refine((body) => Object.keys(body).length > 0, { message: 'send at least one of name, role, disabled' });
export type UpdatePersonRequest = z.infer<typeof updatePersonRequestSchema>;

export const changePasswordRequestSchema = z.object({
  currentPassword: z.string().min(1, { message: 'currentPassword is required' }).max(200),
  newPassword: password,
});
export type ChangePasswordRequest = z.infer<typeof changePasswordRequestSchema>;
