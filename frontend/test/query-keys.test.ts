import { QueryClient } from '@tanstack/react-query';
import { studyReviewQueries } from '@/features/reviews/api/review-queries';
import { studiesQueries } from '@/features/studies/api/studies-queries';

describe('study cache keys', () => {
  it('a review action on a study marks the wizard copy and every review view of it stale, and no other study', async () => {
    const client = new QueryClient();
    client.setQueryData(studiesQueries.detail('s1').queryKey, { id: 's1' } as never);
    client.setQueryData(studyReviewQueries.detail('s1').queryKey, { id: 's1' } as never);
    client.setQueryData(studyReviewQueries.history('s1').queryKey, []);
    client.setQueryData(studiesQueries.detail('s2').queryKey, { id: 's2' } as never);

    await client.invalidateQueries({ queryKey: studyReviewQueries.study('s1') });

    const stale = (key: readonly unknown[]) => client.getQueryState(key)?.isInvalidated;
    expect(stale(studiesQueries.detail('s1').queryKey)).toBe(true);
    expect(stale(studyReviewQueries.detail('s1').queryKey)).toBe(true);
    expect(stale(studyReviewQueries.history('s1').queryKey)).toBe(true);
    expect(stale(studiesQueries.detail('s2').queryKey)).toBe(false);
  });

  it('a saved list refresh leaves the open study alone', async () => {
    const firstPage = { sort: 'updatedAt', order: 'desc', page: 1, pageSize: 20 } as const;
    const client = new QueryClient();
    client.setQueryData(studiesQueries.detail('s1').queryKey, { id: 's1' } as never);
    client.setQueryData(studiesQueries.list(firstPage).queryKey, { items: [] } as never);
    await client.invalidateQueries({ queryKey: studiesQueries.lists() });
    expect(client.getQueryState(studiesQueries.detail('s1').queryKey)?.isInvalidated).toBe(false);
    expect(client.getQueryState(studiesQueries.list(firstPage).queryKey)?.isInvalidated).toBe(true);
  });
});
