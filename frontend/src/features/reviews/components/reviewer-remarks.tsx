import { formatDateTime, STUDY_SECTION_LABELS } from '@meritline/shared';
import { Box, Heading, List, Stack, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { studyReviewQueries } from '../api/review-queries';
import type { StudyComment } from '../api/review-types';

export const openThreads = (comments: readonly StudyComment[]) => comments.filter((c) => !c.threadId && !c.resolved);

/** Open comment threads in short: section and the first words, for a list the reader takes in at a glance. */
export function OpenCommentList({ comments }: { comments: readonly StudyComment[] }) {
  return (
    <List.Root gap="1" ps="5" fontSize="sm" data-testid="open-comments">
      {comments.map((comment) => (
        <List.Item key={comment.id}>
          <Text as="span" fontWeight="600">
            {STUDY_SECTION_LABELS[comment.section]}
          </Text>
          : {comment.body.length > 140 ? `${comment.body.slice(0, 140)}…` : comment.body}{' '}
          <Text as="span" color="fg.muted">
            ({comment.authorName})
          </Text>
        </List.Item>
      ))}
    </List.Root>
  );
}

/** What the reviewer asked for when returning the study, shown to the author where they make the changes. */
export function ReviewerRemarks({ studyId }: { studyId: string }) {
  const history = useQuery(studyReviewQueries.history(studyId));
  const comments = useQuery(studyReviewQueries.comments(studyId));
  const returned = history.data?.filter((item) => item.action === 'study.returned').at(-1);
  const open = openThreads(comments.data ?? []);
  if (!returned && open.length === 0) return null;
  return (
    <Stack gap="3" data-testid="reviewer-remarks">
      {returned && (
        <Box>
          <Heading as="h3" size="sm">
            {returned.actorName} returned it on {formatDateTime(returned.at)}:
          </Heading>
          <Text whiteSpace="pre-wrap">{returned.detail}</Text>
        </Box>
      )}
      {open.length > 0 && (
        <Box>
          <Heading as="h3" size="sm">
            {open.length === 1 ? 'One comment is still open' : `${open.length} comments are still open`}
          </Heading>
          <OpenCommentList comments={open} />
        </Box>
      )}
    </Stack>
  );
}
