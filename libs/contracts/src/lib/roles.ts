import { z } from 'zod';

/** The four roles of DESIGN.md ("Users and roles"), from most to least powerful. */
export const ROLES = ['admin', 'lead', 'analyst', 'viewer'] as const;

export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;
