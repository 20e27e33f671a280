import { can, type Role, type Study } from '@tallyfit/contracts';

/** Whether the person may rename, archive and manage the members of this study (the capability table's rule). */
export function managesStudy(role: Role | null | undefined, study: Pick<Study, 'myStudyRole'>): boolean {
  return can(role, 'studies.manage', study.myStudyRole);
}

/** Whether the person may add analyses and datasets to this study; an archived study takes no new work. */
export function runsInStudy(role: Role | null | undefined, study: Pick<Study, 'myStudyRole' | 'archived'>): boolean {
  return !study.archived && can(role, 'analyses.run', study.myStudyRole);
}
