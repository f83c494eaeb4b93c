import { Heading, SimpleGrid, Stack } from '@chakra-ui/react';
import { hasAnyRole, Role, RUN_REVIEW_STATUS_LABELS, STUDY_STATUS_LABELS, formatDateTime } from '@meritline/shared';
import { useQuery } from '@tanstack/react-query';
import { paths } from '@/lib/config/paths';
import { overviewQueries } from '../api/overview-queries';
import { WorkList, type WorkItem } from './work-list';

/** Per role, what waits for the signed-in person, each item a link to where it is done. */
export function WaitingWork({ roles }: { roles: readonly Role[] }) {
  const analyst = roles.includes(Role.Analyst);
  const reviewer = hasAnyRole(roles, [Role.Reviewer, Role.QualityManager]);
  const quality = roles.includes(Role.QualityManager);
  const oversight = hasAnyRole(roles, [Role.QualityManager, Role.Admin]);
  const work = useQuery(overviewQueries.work());
  const queue = useQuery({ ...overviewQueries.reviewQueue(), enabled: reviewer });
  const returnedStudies = useQuery({ ...overviewQueries.returnedStudies(), enabled: analyst });
  const auditReview = useQuery({ ...overviewQueries.latestAuditReview(), enabled: oversight });

  const lists: { title: string; items: WorkItem[] | undefined; empty: string; loading: boolean; counted?: boolean }[] = [];
  if (reviewer) {
    lists.push({
      title: 'Waiting for your review',
      loading: queue.isPending,
      empty: 'Nothing is waiting for your review.',
      items: queue.data?.map((entry) =>
        entry.kind === 'study'
          ? {
              key: `study-${entry.id}`,
              href: paths.studyView.getHref(entry.id),
              label: entry.title,
              detail: `Validation study by ${entry.authorName} · ${entry.methodName}, version ${entry.methodVersionNumber} · ${STUDY_STATUS_LABELS[entry.status]}`,
            }
          : {
              key: `run-${entry.id}`,
              href: paths.runDetail.getHref(entry.id),
              label: entry.title,
              detail: `Routine run · ${RUN_REVIEW_STATUS_LABELS[entry.status]}`,
            },
      ),
    });
  }
  if (analyst) {
    lists.push({
      title: 'Returned to you for changes',
      loading: returnedStudies.isPending || work.isPending,
      empty: 'None of your studies or runs has been returned.',
      items: returnedStudies.data &&
        work.data && [
          ...returnedStudies.data.map((study) => ({
            key: `study-${study.id}`,
            href: paths.studyView.getHref(study.id),
            label: study.title,
            detail: `Validation study · returned, last changed ${formatDateTime(study.updatedAt)}`,
          })),
          ...work.data.returnedRuns.map((run) => ({
            key: `run-${run.id}`,
            href: paths.runDetail.getHref(run.id),
            label: run.title,
            detail: run.comment ? `Routine run · “${run.comment}”` : 'Routine run',
          })),
        ],
    });
  }
  if (oversight) {
    lists.push({
      title: 'Method versions awaiting activation',
      loading: work.isPending,
      empty: 'No method version is in draft.',
      items: work.data?.versionsAwaitingActivation.map((v) => ({
        key: v.versionId,
        href: paths.methodDetail.getHref(v.methodId),
        label: `${v.methodName}, version ${v.number}`,
        detail: `Draft since ${formatDateTime(v.createdAt)}`,
      })),
    });
    lists.push({
      title: 'Last review of the audit trail',
      counted: false,
      loading: auditReview.isPending,
      empty: 'The audit trail has not been marked as reviewed yet.',
      items: auditReview.data
        ? [
            {
              key: auditReview.data.id,
              href: paths.auditTrail.getHref(
                auditReview.data.recordKind && auditReview.data.recordId
                  ? { record: `${auditReview.data.recordKind}:${auditReview.data.recordId}` }
                  : {},
              ),
              label: auditReview.data.subject,
              detail: `Reviewed by ${auditReview.data.reviewerName} on ${formatDateTime(auditReview.data.reviewedAt)}`,
            },
          ]
        : [],
    });
  }
  if (quality) {
    lists.push({
      title: 'Control-chart signals',
      loading: work.isPending,
      empty: 'No control chart has signalled in the last 30 days.',
      items: work.data?.driftSignals.map((signal) => ({
        key: signal.id,
        href: paths.runControlChart.getHref(signal.methodVersionId),
        label: `${signal.methodName}, version ${signal.versionNumber}`,
        detail: `${formatDateTime(signal.at)}: ${signal.message}`,
      })),
    });
    lists.push({
      title: 'Approved although criteria were not met',
      loading: work.isPending,
      empty: 'No approval or activation needed a justification.',
      items: work.data?.justifiedApprovals.map((item) => ({
        key: `${item.kind}-${item.id}-${item.at ?? ''}`,
        href: item.kind === 'study' ? paths.studyView.getHref(item.id) : paths.methodDetail.getHref(item.methodId ?? ''),
        label: item.title,
        detail: `${item.signerName ? `${item.signerName}${item.at ? `, ${formatDateTime(item.at)}` : ''}: ` : ''}“${item.justification}”`,
      })),
    });
  }
  if (!lists.length) return null;
  return (
    <Stack gap="4" as="section" aria-labelledby="work-heading">
      <Heading id="work-heading" as="h2" size="md">
        Waiting for you
      </Heading>
      <SimpleGrid columns={{ base: 1, md: 2 }} gap="4">
        {lists.map((list) => (
          <WorkList key={list.title} {...list} />
        ))}
      </SimpleGrid>
    </Stack>
  );
}
