import { formatDateTime, STUDY_SECTION_LABELS, type StudySection } from '@meritline/shared';
import { Badge, Box, Button, Heading, HStack, Stack, Text, Textarea } from '@chakra-ui/react';
import { useState } from 'react';
import { Form } from '@/components/form/form';
import { FormField } from '@/components/form/form-field';
import { SelectField } from '@/components/form/select-field';
import { commentSchema, usePostComment, useResolveComment } from '../api/comments';
import type { StudyComment } from '../api/review-types';

const SECTIONS = Object.keys(STUDY_SECTION_LABELS) as StudySection[];

interface Thread {
  root: StudyComment;
  replies: StudyComment[];
}

function threadsOf(comments: readonly StudyComment[]): Thread[] {
  const threads = comments.filter((c) => !c.threadId).map((root) => ({ root, replies: comments.filter((c) => c.threadId === root.id) }));
  return threads.sort((a, b) => SECTIONS.indexOf(a.root.section) - SECTIONS.indexOf(b.root.section));
}

export function openThreadCount(comments: readonly StudyComment[]): number {
  return comments.filter((c) => !c.threadId && !c.resolved).length;
}

/** Comments pinned to a section of the study, in threads that can be answered and resolved. */
export function CommentsPanel({ studyId, comments }: { studyId: string; comments: readonly StudyComment[] }) {
  const post = usePostComment(studyId);
  const threads = threadsOf(comments);
  return (
    <Stack gap="8">
      <Box p="4" borderWidth="1px" borderRadius="l3" bg="bg.panel">
        <Heading as="h3" size="sm" mb="3">
          New comment
        </Heading>
        <Form
          initialValues={{ section: 'standards' as StudySection, body: '' }}
          validationSchema={commentSchema}
          resetOnSuccess
          onSubmit={(values) => post.mutateAsync({ section: values.section, body: values.body })}
          submitLabel="Post comment"
        >
          <SelectField
            name="section"
            label="Section of the study"
            options={SECTIONS.map((section) => ({ value: section, label: STUDY_SECTION_LABELS[section] }))}
          />
          <FormField name="body" label="Comment" required>
            {(field) => <Textarea {...field} value={(field.value as string) ?? ''} rows={3} />}
          </FormField>
        </Form>
      </Box>
      {threads.length === 0 ? (
        <Text color="fg.muted">No comments yet.</Text>
      ) : (
        <Stack gap="4">
          {threads.map((thread) => (
            <CommentThread key={thread.root.id} studyId={studyId} thread={thread} />
          ))}
        </Stack>
      )}
    </Stack>
  );
}

function CommentThread({ studyId, thread }: { studyId: string; thread: Thread }) {
  const [replying, setReplying] = useState(false);
  const post = usePostComment(studyId);
  const resolve = useResolveComment(studyId);
  const { root } = thread;
  return (
    <Box p="4" borderWidth="1px" borderRadius="l3" bg={root.resolved ? 'bg.subtle' : 'bg.panel'} data-testid="comment-thread">
      <HStack justify="space-between" mb="2" wrap="wrap">
        <HStack gap="2">
          <Badge colorPalette="brand" variant="subtle">
            {STUDY_SECTION_LABELS[root.section]}
          </Badge>
          {root.resolved && <Badge colorPalette="green">Resolved</Badge>}
        </HStack>
        <HStack gap="2">
          <Button size="xs" variant="ghost" onClick={() => setReplying((value) => !value)}>
            Reply
          </Button>
          <Button
            size="xs"
            variant="outline"
            loading={resolve.isPending}
            onClick={() => resolve.mutate({ commentId: root.id, resolved: !root.resolved })}
          >
            {root.resolved ? 'Reopen' : 'Resolve'}
          </Button>
        </HStack>
      </HStack>
      <Stack gap="3">
        {[root, ...thread.replies].map((comment) => (
          <Box key={comment.id} pl={comment.threadId ? '4' : '0'} borderLeftWidth={comment.threadId ? '2px' : '0'} borderColor="border">
            <Text fontSize="sm" color="fg.muted">
              {comment.authorName} · {formatDateTime(comment.createdAt)}
            </Text>
            <Text whiteSpace="pre-wrap">{comment.body}</Text>
          </Box>
        ))}
      </Stack>
      {replying && (
        <Box mt="3">
          <Form
            initialValues={{ body: '' }}
            validationSchema={commentSchema}
            onSubmit={async (values) => {
              await post.mutateAsync({ section: root.section, body: values.body, threadId: root.id });
              setReplying(false);
            }}
            submitLabel="Post reply"
          >
            <FormField name="body" label="Reply" required>
              {(field) => <Textarea {...field} value={(field.value as string) ?? ''} rows={2} />}
            </FormField>
          </Form>
        </Box>
      )}
    </Box>
  );
}
