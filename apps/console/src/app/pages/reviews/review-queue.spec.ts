import type { AnalysisSummary } from '@tallyfit/contracts';
import { reviewQueue } from './review-queue';

const analysis = (id: number, authorId: number, updatedAt: string, status: AnalysisSummary['status'] = 'in_review'): AnalysisSummary =>
  ({ id, author: { id: authorId, name: `Person ${authorId}` }, status, isLatest: true, updatedAt }) as AnalysisSummary;

describe('a reviewer’s queue', () => {
  it('lists work waiting for review, longest waiting first, without the reviewer’s own', () => {
    const queue = reviewQueue(
      [
        analysis(1, 3, '2026-12-02T10:00:00Z'),
        analysis(2, 7, '2026-12-01T09:00:00Z'),
        analysis(3, 3, '2026-12-02T08:00:00Z', 'returned'),
        analysis(4, 3, '2026-11-30T08:00:00Z'),
      ],
      7,
    );
    expect(queue.map((a) => a.id)).toEqual([4, 1]);
  });
});
