import type { StudyRole } from '@tallyfit/contracts';

/** The study roles as people read them. */
export const STUDY_ROLE_WORDS: Record<StudyRole, string> = {
  owner: 'Owner',
  contributor: 'Contributor',
  reader: 'Reader',
};
