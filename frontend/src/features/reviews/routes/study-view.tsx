import { formatDateTime } from '@meritline/shared';
import { Alert, Badge, Box, Button, Heading, HStack, Stack, Tabs, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link as RouterLink, useParams } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { PageSpinner } from '@/components/page-spinner';
import { QueryError } from '@/components/query-error';
import { CalibrationPlot, ResidualPlot, StudyFigures, StudyFlags, VerdictSummary } from '@/components/study-results';
import { useSession } from '@/lib/auth';
import { paths } from '@/lib/config/paths';
import { studyReviewQueries } from '../api/review-queries';
import { STATUS_LABELS, type HistoryItem, type StudyView } from '../api/review-types';
import { ApprovalCaution } from '../components/approval-caution';
import { CommentsPanel, openThreadCount } from '../components/comments-panel';
import { DiffPanel } from '../components/diff-panel';
import { HistoryTimeline } from '../components/history-timeline';
import { ReviewActions } from '../components/review-actions';
import { BrokenSignatureWarning, SignaturesPanel } from '../components/signatures-panel';
import { StudyDataSections } from '../components/study-data-sections';

const STATUS_COLOURS = { draft: 'gray', submitted: 'orange', returned: 'red', approved: 'green' } as const;

function lastReturn(history: readonly HistoryItem[] | undefined): HistoryItem | undefined {
  return history?.filter((item) => item.action === 'study.returned').at(-1);
}

/** A study as a reviewer sees it: read-only, with its signatures, comments, history and the changes since the last submission. */
export default function StudyViewPage() {
  const { studyId = '' } = useParams();
  const { user } = useSession();
  const study = useQuery(studyReviewQueries.detail(studyId));
  const signatures = useQuery(studyReviewQueries.signatures(studyId));
  const comments = useQuery(studyReviewQueries.comments(studyId));
  const history = useQuery(studyReviewQueries.history(studyId));
  const diff = useQuery(studyReviewQueries.diff(studyId));
  // After a resubmission the reviewer starts with what changed, once that has loaded.
  const [chosenTab, setChosenTab] = useState<string | null>(null);

  if (study.isError) return <QueryError error={study.error} title="The study could not be loaded" onRetry={() => void study.refetch()} />;
  if (study.isPending || !user) return <PageSpinner label="Loading the study" />;
  const s = study.data;
  const awaitingRelease =
    s.status === 'submitted' && signatures.data?.some((sig) => sig.meaning === 'reviewed-and-approved' && !sig.superseded);
  const returned = s.status === 'returned' ? lastReturn(history.data) : undefined;
  const open = openThreadCount(comments.data ?? []);

  return (
    <>
      <PageHeader
        section="Validation study"
        title={s.title}
        description={
          <HStack as="span" gap="3" wrap="wrap">
            <Badge colorPalette={STATUS_COLOURS[s.status]} size="lg" data-testid="study-status">
              {awaitingRelease ? 'Awaiting release' : STATUS_LABELS[s.status]}
            </Badge>
            <Text as="span">
              {s.method.name}, version {s.methodVersion.number} · by {s.author.name}
              {s.submittedAt && ` · submitted ${formatDateTime(s.submittedAt)}`}
              {s.approvedAt && ` · approved ${formatDateTime(s.approvedAt)}`}
            </Text>
          </HStack>
        }
        actions={
          <HStack gap="3" wrap="wrap">
            <Button variant="outline" asChild>
              <RouterLink to={paths.auditTrail.getHref({ record: `study:${s.id}` })}>Audit trail</RouterLink>
            </Button>
            {signatures.data && <ReviewActions study={s} signatures={signatures.data} user={user} />}
          </HStack>
        }
      />
      <Stack gap="6">
        {signatures.data && <BrokenSignatureWarning signatures={signatures.data} />}
        {returned && (
          <Alert.Root status="warning">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Title>
                Returned by {returned.actorName} on {formatDateTime(returned.at)}
              </Alert.Title>
              <Alert.Description whiteSpace="pre-wrap">{returned.detail}</Alert.Description>
            </Alert.Content>
          </Alert.Root>
        )}
        {awaitingRelease && (
          <Alert.Root status="info">
            <Alert.Indicator />
            <Alert.Content>
              <Alert.Description>
                A reviewer approved this study. The method version requires a quality manager’s release before it counts as approved.
              </Alert.Description>
            </Alert.Content>
          </Alert.Root>
        )}
        <Tabs.Root
          value={chosenTab ?? (diff.data ? 'changes' : 'results')}
          onValueChange={(event) => setChosenTab(event.value)}
          variant="line"
          lazyMount
        >
          <Tabs.List flexWrap="wrap">
            <Tabs.Trigger value="results">Results</Tabs.Trigger>
            <Tabs.Trigger value="data">Data</Tabs.Trigger>
            <Tabs.Trigger value="comments">
              Comments
              {open > 0 && (
                <Badge colorPalette="orange" size="sm">
                  {open} open
                </Badge>
              )}
            </Tabs.Trigger>
            <Tabs.Trigger value="signatures">Signatures</Tabs.Trigger>
            <Tabs.Trigger value="history">History</Tabs.Trigger>
            {diff.data && <Tabs.Trigger value="changes">Changes since last submission</Tabs.Trigger>}
          </Tabs.List>
          <Box pt="6">
            <Tabs.Content value="results">
              <ResultsTab study={s} />
            </Tabs.Content>
            <Tabs.Content value="data">
              <StudyDataSections data={s.data} units={unitsOf(s)} />
            </Tabs.Content>
            <Tabs.Content value="comments">{comments.data && <CommentsPanel studyId={s.id} comments={comments.data} />}</Tabs.Content>
            <Tabs.Content value="signatures">{signatures.data && <SignaturesPanel signatures={signatures.data} />}</Tabs.Content>
            <Tabs.Content value="history">{history.data && <HistoryTimeline items={history.data} />}</Tabs.Content>
            <Tabs.Content value="changes">
              <DiffPanel diff={diff.data ?? null} data={s.data} unit={unitsOf(s).x} />
            </Tabs.Content>
          </Box>
        </Tabs.Root>
      </Stack>
    </>
  );
}

function unitsOf(study: StudyView) {
  return { x: study.data.units?.x ?? study.method.xUnit, y: study.data.units?.y ?? study.method.yUnit };
}

function ResultsTab({ study }: { study: StudyView }) {
  if (!study.result) {
    return (
      <Alert.Root status="warning">
        <Alert.Indicator />
        <Alert.Content>
          <Alert.Title>No results yet</Alert.Title>
          <Alert.Description>
            {study.resultErrors?.map((error) => error.message).join(' ') ?? 'The data cannot be evaluated yet.'}
          </Alert.Description>
        </Alert.Content>
      </Alert.Root>
    );
  }
  const props = { data: study.data, result: study.result, units: unitsOf(study), criteria: study.methodVersion.criteria };
  return (
    <Stack gap="10">
      <VerdictSummary result={props.result} criteria={props.criteria} />
      <ApprovalCaution />
      <Stack gap="3">
        <Heading as="h2" size="lg">
          Points to check
        </Heading>
        <StudyFlags result={props.result} units={props.units} />
      </Stack>
      {study.result.calibration && (
        <Stack gap="4">
          <Heading as="h2" size="lg">
            Calibration
          </Heading>
          <CalibrationPlot {...props} />
          <ResidualPlot {...props} />
        </Stack>
      )}
      <StudyFigures {...props} />
      {study.meta.conclusion && (
        <Stack gap="2">
          <Heading as="h2" size="lg">
            Conclusion
          </Heading>
          <Text whiteSpace="pre-wrap">{study.meta.conclusion}</Text>
        </Stack>
      )}
    </Stack>
  );
}
