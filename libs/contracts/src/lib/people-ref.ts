import { z } from 'zod';

/** A person named in another record (author, member, reviewer). */
export const personRefSchema = z.object({ id: z.number().int(), name: z.string() });
export type PersonRef = z.infer<typeof personRefSchema>;
