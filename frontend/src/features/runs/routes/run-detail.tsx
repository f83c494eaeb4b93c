import { formatDateTime, RunReviewStatus } from '@meritline/shared';
import { Button, HStack, Menu, Portal, Stack, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link as RouterLink, useParams } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { PageSpinner } from '@/components/page-spinner';
import { QueryError } from '@/components/query-error';
import { MODEL_LABELS } from '@/components/study-results';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import { paths } from '@/lib/config/paths';
import { downloadRunFile, type RunFileKind } from '../api/run-files';
import { runsQueries } from '../api/runs-queries';
import { RunReleaseActions, RunReleasePanel, RunReviewBadge, useRunReview } from '../components/run-release-panel';
import { RunResultView } from '../components/run-result-view';
import { RunStatusBadge } from '../components/run-status-badge';

const FILES: { kind: RunFileKind; label: string }[] = [
  { kind: 'csv', label: 'Results as CSV' },
  { kind: 'xlsx', label: 'Workbook (XLSX)' },
  { kind: 'pdf', label: 'Run sheet (PDF)' },
];

export default function RunDetailPage() {
  const { runId = '' } = useParams();
  const run = useQuery(runsQueries.detail(runId));
  const review = useRunReview(runId);
  const [busy, setBusy] = useState<RunFileKind | null>(null);

  if (run.isPending) return <PageSpinner label="Loading the run" />;
  if (run.isError) return <QueryError error={run.error} title="The run could not be loaded" onRetry={() => void run.refetch()} />;
  const r = run.data;
  const stem = `run-${r.title.replace(/[^\w.-]+/g, '-').toLowerCase()}`;

  const download = async (kind: RunFileKind) => {
    setBusy(kind);
    try {
      await downloadRunFile(r.id, kind, stem);
    } catch (error) {
      toaster.create({
        type: 'error',
        title: 'The file could not be made',
        description: isApiError(error) ? error.body.message : undefined,
      });
    } finally {
      setBusy(null);
    }
  };

  return (
    <>
      <PageHeader
        section="Routine batches"
        title={r.title}
        description={
          <HStack as="span" gap="3" wrap="wrap">
            <RunStatusBadge status={r.status} />
            {review.data && <RunReviewBadge status={review.data.reviewStatus} />}
            <span>
              {r.method.name}, version {r.versionNumber} · {MODEL_LABELS[r.model] ?? r.model} · {r.author.name} ·{' '}
              {formatDateTime(r.createdAt)}
            </span>
          </HStack>
        }
        actions={
          <HStack gap="3" wrap="wrap">
            {review.data && <RunReleaseActions runId={r.id} review={review.data} />}
            {review.data?.reviewStatus === RunReviewStatus.Released && r.status === 'accepted' && (
              <Button loading={busy === 'report'} onClick={() => void download('report')}>
                Signed results report
              </Button>
            )}
            <Menu.Root>
              <Menu.Trigger asChild>
                <Button variant="outline" loading={busy !== null && busy !== 'report'}>
                  Export
                </Button>
              </Menu.Trigger>
              <Portal>
                <Menu.Positioner>
                  <Menu.Content>
                    {FILES.map((file) => (
                      <Menu.Item key={file.kind} value={file.kind} onSelect={() => void download(file.kind)}>
                        {file.label}
                      </Menu.Item>
                    ))}
                  </Menu.Content>
                </Menu.Positioner>
              </Portal>
            </Menu.Root>
            <Button variant="outline" asChild>
              <RouterLink to={paths.auditTrail.getHref({ record: `run:${r.id}` })}>Audit trail</RouterLink>
            </Button>
            <Button asChild>
              <RouterLink to={paths.runNew.getHref({ from: r.id })}>New run from this one</RouterLink>
            </Button>
          </HStack>
        }
      />
      <Stack gap="6">
        {review.data && <RunReleasePanel review={review.data} />}
        <RunResultView
          status={r.status}
          result={r.result}
          rejectionReasons={r.rejectionReasons}
          data={r.data}
          units={{ x: r.method.xUnit, y: r.method.yUnit }}
        />
        <Text fontSize="xs" color="fg.muted">
          Saved runs do not change: a correction is a new run. Data SHA-256 {r.dataHash} · engine {r.engineVersion} ·{' '}
          <RouterLink to={paths.runControlChart.getHref(r.methodVersionId)}>control charts of this version</RouterLink>
        </Text>
      </Stack>
    </>
  );
}
