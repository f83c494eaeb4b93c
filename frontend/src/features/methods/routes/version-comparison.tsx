import { Alert, Box, Field, Heading, Link, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import {
  METHOD_VERSION_STATUS_LABELS,
  type VersionComparisonResponse,
  type MethodDto,
  type MethodVersionDto,
  formatNumber,
} from '@meritline/shared';
import { useQuery } from '@tanstack/react-query';
import { useMemo, useState, type ReactNode } from 'react';
import { Link as RouterLink, useSearchParams } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { PageSpinner } from '@/components/page-spinner';
import { QueryError } from '@/components/query-error';
import { SelectControl, type SelectControlProps } from '@/components/select-control';
import { paths } from '@/lib/config/paths';
import { comparisonsQueries } from '../api/comparisons-queries';
import { methodsQueries } from '../api/methods-queries';
import { AssessmentAction } from '../components/comparison/assessment-action';
import { ChangesTable } from '../components/comparison/changes-table';
import { ComparisonTests } from '../components/comparison/comparison-tests';
import { DetectionComparisonTable, RangeComparisonText } from '../components/comparison/detection-range';
import { FiguresComparisonTable } from '../components/comparison/figures-comparison-table';
import { TrendPlots } from '../components/comparison/trend-plots';

/** The active version against the one before it; without an active version, the two newest. */
function defaultPair(method: MethodDto): [MethodVersionDto, MethodVersionDto] | null {
  const versions = [...method.versions].sort((a, b) => a.number - b.number);
  if (versions.length < 2) return null;
  const activeIndex = versions.findIndex((v) => v.status === 'active');
  const later = activeIndex > 0 ? activeIndex : versions.length - 1;
  return [versions[later - 1], versions[later]];
}

const versionLabel = (v: { number: number; status: keyof typeof METHOD_VERSION_STATUS_LABELS }) =>
  `Version ${v.number} (${METHOD_VERSION_STATUS_LABELS[v.status].toLowerCase()})`;

function Section({ title, description, children }: { title: string; description?: string; children: ReactNode }) {
  return (
    <Stack gap="3" as="section" aria-label={title}>
      <Heading as="h2" size="xl">
        {title}
      </Heading>
      {description && <Text color="fg.muted">{description}</Text>}
      {children}
    </Stack>
  );
}

function Picker({ label, ...select }: { label: string } & Pick<SelectControlProps, 'value' | 'onChange' | 'options'>) {
  return (
    <Field.Root>
      <Field.Label>{label}</Field.Label>
      <SelectControl {...select} />
    </Field.Root>
  );
}

function ComparisonBody({ comparison, lockVersion }: { comparison: VersionComparisonResponse; lockVersion: number | null }) {
  const fromLabel = `Version ${comparison.from.number}`;
  const toLabel = `Version ${comparison.to.number}`;
  const { xUnit, yUnit } = comparison.method;
  const units = useMemo(() => ({ x: xUnit, y: yUnit }), [xUnit, yUnit]);
  return (
    <Stack gap="10">
      {comparison.missing.length > 0 && (
        <Alert.Root status="warning">
          <Alert.Indicator />
          <Alert.Content>
            <Alert.Title>Part of the comparison is missing</Alert.Title>
            <Alert.Description>{comparison.missing.join(' ')}</Alert.Description>
          </Alert.Content>
        </Alert.Root>
      )}
      <Section
        title="What changed"
        description="The two versions and the studies that stand for them, side by side; changed aspects in bold."
      >
        <ChangesTable rows={comparison.changes} fromLabel={fromLabel} toLabel={toLabel} />
      </Section>
      <Section
        title="Statistical tests"
        description={`Each test at α = ${formatNumber(comparison.alpha, 3)}, the significance level of the later study. A significant difference is a reason to look, not a verdict on the method: judge it against the lab's procedures and qualified review.`}
      >
        <ComparisonTests comparison={comparison} />
      </Section>
      <Section
        title="Figures"
        description="Every figure either study gives, with the acceptance criterion of the later version where there is one."
      >
        <FiguresComparisonTable rows={comparison.figures} fromLabel={fromLabel} toLabel={toLabel} units={units} />
      </Section>
      <Section
        title="Detection and quantitation limits"
        description="Ratio later / earlier per approach; below 1 the later version sees lower amounts."
      >
        <DetectionComparisonTable rows={comparison.detection} unit={units.x} />
      </Section>
      <Section title="Working range">
        <RangeComparisonText range={comparison.range} unit={units.x} />
      </Section>
      {lockVersion !== null && (
        <Section
          title="Change assessment"
          description={`Record your assessment of version ${comparison.to.number} against version ${comparison.from.number} under your e-signature: a signed PDF kept against version ${comparison.to.number}.`}
        >
          <div>
            <AssessmentAction comparison={comparison} lockVersion={lockVersion} />
          </div>
        </Section>
      )}
    </Stack>
  );
}

export default function VersionComparisonPage() {
  const [params, setParams] = useSearchParams();
  // The choice lives here (two quick picks must not overwrite each other); the address only mirrors it for sharing.
  const [choice, setChoice] = useState(() => ({
    method: params.get('method') ?? '',
    from: params.get('from') ?? '',
    to: params.get('to') ?? '',
  }));
  const methods = useQuery(methodsQueries.list());
  const methodId = choice.method || (methods.data?.find((m) => m.versions.length >= 2)?.id ?? '');
  const method = methods.data?.find((m) => m.id === methodId);
  const pair = method ? defaultPair(method) : null;
  const fromId = choice.from || (pair?.[0].id ?? '');
  const toId = choice.to || (pair?.[1].id ?? '');
  const ready = Boolean(method && fromId && toId && fromId !== toId);
  const comparison = useQuery({ ...comparisonsQueries.compare(fromId, toId), enabled: ready });
  const trend = useQuery({ ...comparisonsQueries.trend(methodId), enabled: Boolean(method) });

  const choose = (next: Partial<typeof choice>) => {
    const updated = { ...choice, method: methodId, ...(next.method ? { from: '', to: '' } : {}), ...next };
    setChoice(updated);
    setParams(Object.fromEntries(Object.entries(updated).filter(([, value]) => value)), { replace: true });
  };

  if (methods.isPending) return <PageSpinner label="Loading the methods" />;
  if (methods.isError)
    return <QueryError error={methods.error} title="The methods could not be loaded" onRetry={() => void methods.refetch()} />;

  const versions = [...(method?.versions ?? [])].sort((a, b) => b.number - a.number);
  const versionChoices = versions.map((v) => ({ value: v.id, label: versionLabel(v) }));
  return (
    <>
      <PageHeader
        section="Quality"
        title="Version comparison"
        description="Two versions of a method side by side: what changed, the statistical tests on their validation studies, and the figures over every version."
      />
      <Stack gap="10">
        <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p={{ base: '4', md: '6' }}>
          <SimpleGrid columns={{ base: 1, md: 3 }} gap="4" alignItems="end">
            <Picker
              label="Method"
              value={methodId}
              onChange={(id) => choose({ method: id })}
              options={methods.data.map((m) => ({ value: m.id, label: m.name }))}
            />
            <Picker label="Earlier version" value={fromId} onChange={(id) => choose({ from: id })} options={versionChoices} />
            <Picker label="Later version" value={toId} onChange={(id) => choose({ to: id })} options={versionChoices} />
          </SimpleGrid>
          {method && (
            <Link asChild fontSize="sm" color="brand.fg" mt="3">
              <RouterLink to={paths.methodDetail.getHref(method.id)}>Open the method</RouterLink>
            </Link>
          )}
        </Box>
        {!method && <Text color="fg.muted">Choose a method.</Text>}
        {method && versions.length < 2 && <Text color="fg.muted">This method has one version only: there is nothing to compare yet.</Text>}
        {method && versions.length >= 2 && fromId === toId && <Text color="fg.muted">Choose two different versions.</Text>}
        {ready && comparison.isPending && <PageSpinner label="Comparing the versions" />}
        {ready && comparison.isError && (
          <QueryError error={comparison.error} title="The versions could not be compared" onRetry={() => void comparison.refetch()} />
        )}
        {ready && comparison.data && (
          <ComparisonBody comparison={comparison.data} lockVersion={versions.find((v) => v.id === toId)?.lockVersion ?? null} />
        )}
        {trend.data && (
          <Section
            title="Over every version"
            description="The figures of each version's latest approved study; bars show the confidence interval."
          >
            <TrendPlots trend={trend.data} />
          </Section>
        )}
      </Stack>
    </>
  );
}
