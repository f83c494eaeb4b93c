import { type AuditReviewDto, type CreateAuditReviewRequest, formatDateTime } from '@meritline/shared';
import { Box, Stack, Text } from '@chakra-ui/react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { SignatureDialog } from '@/components/signature-dialog';
import { toaster } from '@/components/ui/toaster';
import { auditQueries, markReviewed, type AuditFilters } from '../api/audit-queries';

/** What "mark as reviewed" covers: the record filtered on, else the period of the date filters. */
export function reviewTarget(
  filters: AuditFilters,
  recordName: string | null,
): { request: Omit<CreateAuditReviewRequest, 'password'>; words: string } | null {
  if (filters.record)
    return { request: { scope: 'record', record: filters.record }, words: `the whole trail of ${recordName ?? 'this record'}` };
  if (filters.from && filters.to) {
    return {
      request: { scope: 'period', periodFrom: filters.from, periodTo: filters.to },
      words: `every entry from ${filters.from} to ${filters.to} (UTC)`,
    };
  }
  return null;
}

export function ReviewPanel({ filters, recordName }: { filters: AuditFilters; recordName: string | null }) {
  const queryClient = useQueryClient();
  const target = reviewTarget(filters, recordName);
  const review = useMutation({
    mutationFn: markReviewed,
    onSuccess: async (saved: AuditReviewDto) => {
      toaster.create({ type: 'success', title: 'Marked as reviewed', description: saved.subject });
      await queryClient.invalidateQueries({ queryKey: auditQueries.all });
    },
  });
  if (!target) {
    return (
      <Text fontSize="sm" color="fg.muted">
        To mark part of the trail as reviewed, filter it to one record or give both the first and the last day of a period.
      </Text>
    );
  }
  return (
    <Box alignSelf="flex-start">
      <SignatureDialog
        title="Mark the audit trail as reviewed"
        meaning={`You confirm that you have reviewed ${target.words}, and that what it records needs no further action or has been followed up.`}
        triggerLabel="Mark as reviewed"
        submitLabel="Sign the review"
        commentLabel="Remarks (optional)"
        onSign={({ password, comment }) => review.mutateAsync({ ...target.request, password, comment: comment || undefined })}
      />
    </Box>
  );
}

export function LatestReview({ review }: { review: AuditReviewDto | undefined }) {
  if (!review) return <Text color="fg.muted">The trail has not been marked as reviewed yet.</Text>;
  return (
    <Stack gap="0" data-testid="latest-review">
      <Text>
        <Text as="span" fontWeight="600">
          {review.subject}
        </Text>{' '}
        reviewed by {review.reviewerName} on {formatDateTime(review.reviewedAt)}
      </Text>
      <Text fontSize="sm" color="fg.muted">
        {review.entries} entries; the chain was {review.chainIntact ? 'intact' : 'broken'} at signing.
        {review.comment ? ` Remarks: ${review.comment}` : ''}
      </Text>
    </Stack>
  );
}
