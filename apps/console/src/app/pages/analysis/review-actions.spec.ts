import type { AnalysisRecord, Review } from '@tallyfit/contracts';
import { openReturn, reviewActions } from './review-actions';

const analysis = (status: AnalysisRecord['status'], authorId = 3, isLatest = true) => ({ status, isLatest, author: { id: authorId, name: 'Ana' } });
const analyst = { id: 3, role: 'analyst' as const };
const lead = { id: 2, role: 'lead' as const };
const admin = { id: 1, role: 'admin' as const };
const viewer = { id: 4, role: 'viewer' as const };

const offered = (actions: object) =>
  Object.entries(actions)
    .filter(([, yes]) => yes)
    .map(([name]) => name);

describe('what the result page offers', () => {
  it('offers the author of a draft submit, edit, change and re-run, and delete', () => {
    expect(offered(reviewActions(analysis('draft'), analyst))).toEqual(['submit', 'edit', 'changeAndRerun', 'remove']);
  });

  it('offers the author of work in review only withdraw, edit and delete; a lead decides', () => {
    expect(offered(reviewActions(analysis('in_review'), analyst))).toEqual(['withdraw', 'edit', 'remove']);
    expect(offered(reviewActions(analysis('in_review'), lead))).toEqual(['decide']);
  });

  it('never lets anyone decide on their own work, nor on an earlier version', () => {
    expect(reviewActions(analysis('in_review', 1), admin).decide).toBe(false);
    expect(reviewActions(analysis('in_review', 3, false), lead).decide).toBe(false);
    expect(reviewActions(analysis('in_review', 3), admin).withdraw).toBe(false);
  });

  it('freezes signed-off work: no edit, deletion only by an admin, but a change makes a new version with its own review', () => {
    expect(offered(reviewActions(analysis('signed_off'), analyst))).toEqual(['changeAndRerun']);
    expect(offered(reviewActions(analysis('signed_off'), admin))).toEqual(['changeAndRerun', 'remove']);
  });

  it('offers returned work back to its author to change and resubmit', () => {
    expect(offered(reviewActions(analysis('returned'), analyst))).toEqual(['submit', 'edit', 'changeAndRerun', 'remove']);
  });

  it('offers a viewer and someone else’s analyst nothing', () => {
    expect(offered(reviewActions(analysis('in_review'), viewer))).toEqual([]);
    expect(offered(reviewActions(analysis('draft', 9), analyst))).toEqual([]);
  });

  it('points at the return the author must act on, and at nothing once it was resubmitted', () => {
    const returned: Review = { id: 2, analysisId: 5, decision: 'returned', comment: 'Which week?', by: { id: 2, name: 'Lee' }, createdAt: '2026-12-02T10:00:00Z' };
    const submitted: Review = { ...returned, id: 1, decision: 'submitted', comment: null };
    expect(openReturn('returned', [submitted, returned])).toBe(returned);
    expect(openReturn('in_review', [submitted, returned, { ...submitted, id: 3 }])).toBeNull();
  });
});
