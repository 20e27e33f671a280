import { z } from 'zod';

/** The four roles, from most to least powerful; what each may do is in `capabilities.ts`. */
export const ROLES = ['admin', 'lead', 'analyst', 'viewer'] as const;

export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;
