import type { Review } from './reviews';
import { reviewStateLines, utcTimeText } from './review-state';

const lead = { id: 2, name: 'Lee Lead' };
const analyst = { id: 3, name: 'Ana Analyst' };
const review = (decision: Review['decision'], by: Review['by'], createdAt: string, comment: string | null = null): Review => ({
  id: 1,
  analysisId: 9,
  decision,
  comment,
  by,
  createdAt,
});

describe('the review facts every page and export prints', () => {
  it('writes times in UTC to the minute', () => {
    expect(utcTimeText('2026-12-02T14:05:59.000Z')).toBe('2026-12-02 14:05 UTC');
  });

  it('names who signed off and when', () => {
    const reviews = [
      review('submitted', analyst, '2026-12-02T10:00:00Z'),
      review('signed_off', lead, '2026-12-02T11:40:00Z'),
    ];
    expect(reviewStateLines('signed_off', reviews)).toEqual(['Review state: Signed off.', 'Signed off by Lee Lead on 2026-12-02 11:40 UTC.']);
  });

  it('names who returned the work, when, and why', () => {
    const reviews = [review('submitted', analyst, '2026-12-02T10:00:00Z'), review('returned', lead, '2026-12-02T10:30:00Z', 'Say which week.')];
    expect(reviewStateLines('returned', reviews)).toEqual([
      'Review state: Returned for changes.',
      'Returned by Lee Lead on 2026-12-02 10:30 UTC.',
      'Reason: Say which week.',
    ]);
  });

  it('says only the state for a draft, also after a withdrawn submission', () => {
    expect(reviewStateLines('draft', [])).toEqual(['Review state: Draft.']);
    expect(reviewStateLines('draft', [review('submitted', analyst, '2026-12-02T10:00:00Z'), review('withdrawn', analyst, '2026-12-02T10:05:00Z')])).toEqual([
      'Review state: Draft.',
    ]);
  });
});
