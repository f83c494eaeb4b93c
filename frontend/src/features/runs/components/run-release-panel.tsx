import { Badge, Box, Card, HStack, Stack, Table, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { Link as RouterLink } from 'react-router';
import {
  Role,
  RUN_REVIEW_STATUS_LABELS,
  RUN_SIGNATURE_MEANING_LABELS,
  RunReviewStatus,
  type RunReviewDto,
  formatDateTime,
} from '@meritline/shared';
import { SignatureDialog } from '@/components/signature-dialog';
import { toaster } from '@/components/ui/toaster';
import { useSession } from '@/lib/auth';
import { paths } from '@/lib/config/paths';
import { runReleaseQueries, useRunReleaseAction } from '../api/run-release';

const STATUS_COLOURS: Record<RunReviewStatus, string> = {
  [RunReviewStatus.Calculated]: 'gray',
  [RunReviewStatus.Submitted]: 'orange',
  [RunReviewStatus.Returned]: 'red',
  [RunReviewStatus.Released]: 'green',
  [RunReviewStatus.Superseded]: 'purple',
};

export function RunReviewBadge({ status }: { status: RunReviewStatus }) {
  return <Badge colorPalette={STATUS_COLOURS[status]}>{RUN_REVIEW_STATUS_LABELS[status]}</Badge>;
}

/** The release actions the signed-in user may take on this run. */
export function RunReleaseActions({ runId, review }: { runId: string; review: RunReviewDto }) {
  const { user } = useSession();
  const submit = useRunReleaseAction(runId, 'submit');
  const release = useRunReleaseAction(runId, 'release');
  const giveBack = useRunReleaseAction(runId, 'return');
  if (!user) return null;
  const own = user.id === review.authorId;
  const roles = user.roles;
  const canSubmit = own && roles.includes(Role.Analyst) && (review.reviewStatus === 'calculated' || review.reviewStatus === 'returned');
  const canReview = !own && roles.includes(Role.Reviewer) && review.reviewStatus === 'submitted';
  const signed =
    (action: typeof submit, title: string) =>
    async ({ password, comment }: { password: string; comment?: string }) => {
      await action.mutateAsync({ password, comment, version: review.lockVersion });
      toaster.create({ type: 'success', title });
    };
  return (
    <>
      {canSubmit && (
        <SignatureDialog
          title="Submit the run for release"
          meaning="Performed: you carried out this run and its data and results are as recorded."
          triggerLabel="Submit for release"
          submitLabel="Sign and submit"
          onSign={signed(submit, 'Run submitted for release')}
        />
      )}
      {canReview && (
        <>
          <SignatureDialog
            title="Return the run to the analyst"
            meaning="You return this run unreleased; the analyst sees your comment."
            triggerLabel="Return"
            triggerVariant="outline"
            submitLabel="Return the run"
            commentLabel="What should the analyst check or redo?"
            commentRequired
            onSign={signed(giveBack, 'Run returned to the analyst')}
          />
          <SignatureDialog
            title="Release the run"
            meaning="Reviewed and released: you checked this run and its results may be reported."
            triggerLabel="Release"
            submitLabel="Sign and release"
            onSign={signed(release, 'Run released')}
          />
        </>
      )}
    </>
  );
}

/** Release status, the return comment or correction link, and the signatures with printed name, time and meaning. */
export function RunReleasePanel({ review }: { review: RunReviewDto }) {
  return (
    <Card.Root variant="outline">
      <Card.Body>
        <Stack gap="3">
          <HStack gap="3">
            <Text fontWeight="600">Release</Text>
            <RunReviewBadge status={review.reviewStatus} />
          </HStack>
          {review.reviewStatus === 'calculated' && (
            <Text fontSize="sm" color="fg.muted">
              Results can be exported once the analyst has submitted the run and a second person has released it.
            </Text>
          )}
          {review.returnComment && review.reviewStatus === 'returned' && (
            <Text fontSize="sm">
              Returned with this comment: <em>{review.returnComment}</em>
            </Text>
          )}
          {review.supersededById && (
            <Text fontSize="sm">
              Replaced by a <RouterLink to={paths.runDetail.getHref(review.supersededById)}>correction run</RouterLink>
              {review.supersedeReason ? `: ${review.supersedeReason}` : '.'}
            </Text>
          )}
          {review.supersedesId && (
            <Text fontSize="sm">
              Corrects a <RouterLink to={paths.runDetail.getHref(review.supersedesId)}>released run</RouterLink>
              {review.supersedeReason ? `: ${review.supersedeReason}` : '.'}
            </Text>
          )}
          {review.signatures.length > 0 && (
            <Box overflowX="auto">
              <Table.Root size="sm" aria-label="Signatures">
                <Table.Header>
                  <Table.Row>
                    <Table.ColumnHeader>Signed by</Table.ColumnHeader>
                    <Table.ColumnHeader>Meaning</Table.ColumnHeader>
                    <Table.ColumnHeader>Date and time</Table.ColumnHeader>
                    <Table.ColumnHeader>Content</Table.ColumnHeader>
                  </Table.Row>
                </Table.Header>
                <Table.Body>
                  {review.signatures.map((s) => (
                    <Table.Row key={s.id}>
                      <Table.Cell>{s.signerName}</Table.Cell>
                      <Table.Cell>{RUN_SIGNATURE_MEANING_LABELS[s.meaning]}</Table.Cell>
                      <Table.Cell>{formatDateTime(s.signedAt)}</Table.Cell>
                      <Table.Cell>{s.valid ? 'Unchanged since signing' : 'Changed since signing'}</Table.Cell>
                    </Table.Row>
                  ))}
                </Table.Body>
              </Table.Root>
            </Box>
          )}
        </Stack>
      </Card.Body>
    </Card.Root>
  );
}

export function useRunReview(runId: string) {
  return useQuery(runReleaseQueries.review(runId));
}
