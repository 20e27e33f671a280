import { can, type AnalysisRecord, type Review, type Role } from '@tallyfit/contracts';

/** What the signed-in person may do with an analysis from its result page. */
export interface ReviewActions {
  /** Sign off or return it (a reviewer, while it waits for review, never on their own work). */
  decide: boolean;
  /** Hand it to a reviewer (its author, or an admin, while it is a draft or was returned). */
  submit: boolean;
  /** Take a submission back to draft (its author only, while it waits). */
  withdraw: boolean;
  /** Change the title and notes (its author or an admin, until it is signed off: then it is frozen). */
  edit: boolean;
  /** Open the flow pre-filled and store the changed run as a new version (not while a reviewer has it). */
  changeAndRerun: boolean;
  /** Delete it with all its versions (its author or an admin; once signed off, only an admin). */
  remove: boolean;
}

type Person = { id: number; role: Role } | null;

export function reviewActions(analysis: Pick<AnalysisRecord, 'status' | 'isLatest' | 'author'>, person: Person): ReviewActions {
  const role = person?.role ?? null;
  const own = person !== null && analysis.author.id === person.id;
  const runs = can(role, 'analyses.run');
  const authorOrAdmin = runs && (own || role === 'admin');
  const latest = analysis.isLatest;
  const { status } = analysis;
  return {
    decide: can(role, 'analyses.review') && !own && latest && status === 'in_review',
    submit: authorOrAdmin && latest && (status === 'draft' || status === 'returned'),
    withdraw: runs && own && latest && status === 'in_review',
    edit: authorOrAdmin && status !== 'signed_off',
    changeAndRerun: authorOrAdmin && latest && status !== 'in_review',
    remove: authorOrAdmin && (status !== 'signed_off' || role === 'admin'),
  };
}

/** The return a person must act on: the latest decision, when it was a return. */
export function openReturn(status: AnalysisRecord['status'], reviews: readonly Review[]): Review | null {
  const latest = reviews.at(-1);
  return status === 'returned' && latest?.decision === 'returned' ? latest : null;
}
