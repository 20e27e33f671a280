import type { Role, Study } from '@tallyfit/contracts';

/** Admins and the study's owners rename, archive and manage members (the API's own rule). */
export function managesStudy(role: Role | null | undefined, study: Pick<Study, 'myStudyRole'>): boolean {
  return role === 'admin' || (role === 'analyst' && study.myStudyRole === 'owner');
}

/** Admins, owners and contributors add analyses and datasets to a study that is not archived. */
export function runsInStudy(role: Role | null | undefined, study: Pick<Study, 'myStudyRole' | 'archived'>): boolean {
  if (study.archived) return false;
  return role === 'admin' || (role === 'analyst' && (study.myStudyRole === 'owner' || study.myStudyRole === 'contributor'));
}
