import { z } from 'zod';
import { idText } from './pagination';
import { roleSchema } from './roles';

/**
 * A member's role inside one study: an owner manages the study and its members, a contributor
 * runs analyses in it, a reader only reads.
 */
export const STUDY_ROLES = ['owner', 'contributor', 'reader'] as const;
export const studyRoleSchema = z.enum(STUDY_ROLES);
export type StudyRole = z.infer<typeof studyRoleSchema>;

const studyName = z.string().trim().min(1, { message: 'name must not be empty' }).max(200, { message: 'name must be at most 200 characters' });
const studyDescription = z.string().trim().max(2000, { message: 'description must be at most 2000 characters' });

export const createStudyRequestSchema = z.object({
  name: studyName,
  description: studyDescription.optional(),
});
export type CreateStudyRequest = z.infer<typeof createStudyRequestSchema>;

export const updateStudyRequestSchema = z
  .object({
    name: studyName.optional(),
    description: studyDescription.nullable().optional(),
    archived: z.boolean().optional(),
  })
  .refine((body) => Object.keys(body).length > 0, { message: 'send at least one of name, description, archived' });
export type UpdateStudyRequest = z.infer<typeof updateStudyRequestSchema>;

export const studyMemberSchema = z.object({
  userId: z.number().int(),
  name: z.string(),
  email: z.string(),
  role: roleSchema.describe("the person's role across Tallyfit"),
  studyRole: studyRoleSchema,
  addedAt: z.string(),
});
export type StudyMember = z.infer<typeof studyMemberSchema>;

export const studySchema = z.object({
  id: z.number().int(),
  name: z.string(),
  description: z.string().nullable(),
  createdBy: z.object({ id: z.number().int(), name: z.string() }),
  createdAt: z.string(),
  updatedAt: z.string(),
  archived: z.boolean(),
  archivedAt: z.string().nullable(),
  memberCount: z.number().int(),
  analysisCount: z.number().int(),
  /** The caller's own role in the study, if they are a member. */
  myStudyRole: studyRoleSchema.nullable(),
});
export type Study = z.infer<typeof studySchema>;

export const studyDetailSchema = studySchema.extend({ members: z.array(studyMemberSchema) });
export type StudyDetail = z.infer<typeof studyDetailSchema>;

export const listStudiesQuerySchema = z.object({
  includeArchived: z
    .enum(['true', 'false'], { message: 'includeArchived must be true or false' })
    .transform((value) => value === 'true')
    .optional(),
});

export const addStudyMemberRequestSchema = z.object({
  userId: z.number().int().positive({ message: 'userId must be a positive whole number' }),
  studyRole: studyRoleSchema,
});
export type AddStudyMemberRequest = z.infer<typeof addStudyMemberRequestSchema>;

export const updateStudyMemberRequestSchema = z.object({ studyRole: studyRoleSchema });
export type UpdateStudyMemberRequest = z.infer<typeof updateStudyMemberRequestSchema>;

export const studyMemberParamsSchema = z.object({
  id: idText('id'),
  userId: idText('userId'),
});
