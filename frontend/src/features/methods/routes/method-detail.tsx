import { Box, DataList, Heading, HStack, Link, Stack, Text } from '@chakra-ui/react';
import { formatDateTime, hasAnyRole, Role } from '@meritline/shared';
import { useQuery } from '@tanstack/react-query';
import { Link as RouterLink, useParams } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { PageSpinner } from '@/components/page-spinner';
import { QueryError } from '@/components/query-error';
import { paths } from '@/lib/config/paths';
import { useSession } from '@/lib/auth';
import { methodsQueries } from '../api/methods-queries';
import { useMethodPermissions } from '../hooks/use-method-permissions';
import { VersionCard } from '../components/version-card';
import { VersionFormDialog } from '../components/version-form-dialog';

export default function MethodDetailPage() {
  const { methodId = '' } = useParams();
  const method = useQuery(methodsQueries.detail(methodId));
  const { canManage, canPropose, canEditDraft } = useMethodPermissions();
  const canCompare = hasAnyRole(useSession().user?.roles ?? [], [Role.QualityManager]);

  if (method.isPending) return <PageSpinner label="Loading the method" />;
  if (method.isError)
    return <QueryError error={method.error} title="The method could not be loaded" onRetry={() => void method.refetch()} />;

  const m = method.data;
  const versions = [...m.versions].sort((a, b) => b.number - a.number);
  const latest = versions[0];

  return (
    <>
      <Link asChild fontSize="sm" color="fg.muted" mb="3">
        <RouterLink to={paths.methods.getHref()}>← All methods</RouterLink>
      </Link>
      <PageHeader
        section="Method"
        title={m.name}
        description={`${m.analyte} in ${m.matrix}, by ${m.technique}.`}
        actions={
          canPropose &&
          latest && (
            <VersionFormDialog
              method={m}
              mode="new"
              version={latest}
              triggerLabel={canManage ? 'New version' : 'Propose a new version'}
              proposal={!canManage}
            />
          )
        }
      />
      <Stack gap="8">
        <Box borderWidth="1px" borderColor="border" borderRadius="l3" bg="bg.panel" p={{ base: '4', md: '6' }}>
          <DataList.Root orientation="horizontal" size="md">
            <DataList.Item>
              <DataList.ItemLabel>Analyte</DataList.ItemLabel>
              <DataList.ItemValue>{m.analyte}</DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Matrix</DataList.ItemLabel>
              <DataList.ItemValue>{m.matrix}</DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Technique</DataList.ItemLabel>
              <DataList.ItemValue>{m.technique}</DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Concentration unit (x)</DataList.ItemLabel>
              <DataList.ItemValue>{m.xUnit}</DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Response unit (y)</DataList.ItemLabel>
              <DataList.ItemValue>{m.yUnit}</DataList.ItemValue>
            </DataList.Item>
            <DataList.Item>
              <DataList.ItemLabel>Created</DataList.ItemLabel>
              <DataList.ItemValue>{formatDateTime(m.createdAt)}</DataList.ItemValue>
            </DataList.Item>
          </DataList.Root>
        </Box>
        <Stack gap="4">
          <HStack justify="space-between">
            <Heading as="h2" size="xl">
              Versions
            </Heading>
            <HStack gap="4">
              {canCompare && versions.length >= 2 && (
                <Link asChild fontSize="sm" color="brand.fg" fontWeight="600">
                  <RouterLink to={`${paths.methodComparison.getHref()}?method=${encodeURIComponent(m.id)}`}>Compare versions</RouterLink>
                </Link>
              )}
              <Text color="fg.muted" fontSize="sm">
                Newest first
              </Text>
            </HStack>
          </HStack>
          {versions.map((version) => (
            <VersionCard key={version.id} method={m} version={version} canManage={canManage} canEdit={canEditDraft(version.createdBy.id)} />
          ))}
        </Stack>
      </Stack>
    </>
  );
}
