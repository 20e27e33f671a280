import type { Role } from '@tallyfit/contracts';

/** Each role with what it may do, in a few words (the capability table in libs/contracts says it exactly). */
export const ROLE_WORDS: Record<Role, { name: string; can: string }> = {
  admin: { name: 'Admin', can: 'everything, plus people and tokens' },
  lead: { name: 'Lead', can: 'reads every study, reviews and signs off' },
  analyst: { name: 'Analyst', can: 'runs analyses in their studies' },
  viewer: { name: 'Viewer', can: 'reads the studies they are invited to' },
};
