import { Box, DataList, Heading, HStack, Stack, Text } from '@chakra-ui/react';
import {
  DEFAULT_ACCURACY_BETA,
  DEFAULT_ACCURACY_LAMBDA_PCT,
  DEFAULT_COVERAGE_FACTOR,
  DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT,
  METHOD_CHANGE_KIND_LABELS,
  REVALIDATION_FAMILY_LABELS,
  type MethodDto,
  type MethodVersionDto,
  formatDateTime,
} from '@meritline/shared';
import { CriteriaList } from './criteria-list';
import { VersionFormDialog } from './version-form-dialog';
import { VersionStatusAction } from './version-status-action';
import { VersionStatusBadge, versionStatusHint } from './version-status-badge';

export interface VersionCardProps {
  method: MethodDto;
  version: MethodVersionDto;
  /** Quality managers and administrators change the status. */
  canManage: boolean;
  /** Who may edit this version while it is a draft. */
  canEdit: boolean;
}

export function VersionCard({ method, version, canManage, canEdit }: VersionCardProps) {
  const active = method.versions.find((v) => v.status === 'active' && v.id !== version.id);
  const { settings } = version;
  return (
    <Box
      as="article"
      aria-labelledby={`version-${version.id}`}
      borderWidth="1px"
      borderColor={version.status === 'active' ? 'brand.solid' : 'border'}
      borderLeftWidth="4px"
      borderRadius="l3"
      bg="bg.panel"
      p={{ base: '4', md: '6' }}
    >
      <Stack gap="5">
        <HStack justify="space-between" align="flex-start" wrap="wrap" gap="3">
          <Stack gap="1">
            <HStack gap="3">
              <Heading as="h3" size="lg" id={`version-${version.id}`}>
                Version {version.number}
              </Heading>
              <VersionStatusBadge status={version.status} />
            </HStack>
            <Text fontSize="sm" color="fg.muted">
              {versionStatusHint(version.status)} Created {formatDateTime(version.createdAt)} by {version.createdBy.name}.
            </Text>
          </Stack>
          <HStack gap="2" wrap="wrap">
            {canEdit && version.status === 'draft' && (
              <VersionFormDialog method={method} mode="edit" version={version} triggerLabel="Edit criteria and settings" />
            )}
            {canManage && <VersionStatusAction version={version} replaces={active?.number} />}
          </HStack>
        </HStack>
        <Text whiteSpace="pre-wrap">{version.changeSummary}</Text>
        <DataList.Root orientation="horizontal" size="sm" variant="subtle">
          {version.changeKind && (
            <>
              <DataList.Item>
                <DataList.ItemLabel>Kind of change</DataList.ItemLabel>
                <DataList.ItemValue>{METHOD_CHANGE_KIND_LABELS[version.changeKind]}</DataList.ItemValue>
              </DataList.Item>
              <DataList.Item>
                <DataList.ItemLabel>Figures to show again</DataList.ItemLabel>
                <DataList.ItemValue>
                  {version.revalidationScope.length
                    ? version.revalidationScope.map((family) => REVALIDATION_FAMILY_LABELS[family]).join(', ')
                    : 'None'}
                  {version.status === 'draft' &&
                    version.revalidationScope.length > 0 &&
                    (version.coverage.covered
                      ? ' (shown by an approved study)'
                      : ` (missing: ${version.coverage.missing.map((family) => REVALIDATION_FAMILY_LABELS[family].toLowerCase()).join(', ')})`)}
                </DataList.ItemValue>
              </DataList.Item>
            </>
          )}
          {version.activationJustification && (
            <DataList.Item>
              <DataList.ItemLabel>Activated with justification</DataList.ItemLabel>
              <DataList.ItemValue>{version.activationJustification}</DataList.ItemValue>
            </DataList.Item>
          )}
          <DataList.Item>
            <DataList.ItemLabel>Validation studies</DataList.ItemLabel>
            <DataList.ItemValue>
              {version.studyCount} ({version.approvedStudyCount} approved)
            </DataList.ItemValue>
          </DataList.Item>
          <DataList.Item>
            <DataList.ItemLabel>Check standard tolerance</DataList.ItemLabel>
            <DataList.ItemValue>± {settings.checkTolerancePct} %</DataList.ItemValue>
          </DataList.Item>
          <DataList.Item>
            <DataList.ItemLabel>One-point calibration</DataList.ItemLabel>
            <DataList.ItemValue>allowed up to an intercept of {settings.onePointMaxInterceptPct} % of the top response</DataList.ItemValue>
          </DataList.Item>
          <DataList.Item>
            <DataList.ItemLabel>Recovery equivalence margin</DataList.ItemLabel>
            <DataList.ItemValue>
              ± {settings.recoveryEquivalenceMarginPct ?? DEFAULT_RECOVERY_EQUIVALENCE_MARGIN_PCT} percentage points
            </DataList.ItemValue>
          </DataList.Item>
          <DataList.Item>
            <DataList.ItemLabel>Accuracy profile and uncertainty</DataList.ItemLabel>
            <DataList.ItemValue>
              β {Math.round(100 * (settings.accuracyBeta ?? DEFAULT_ACCURACY_BETA))} %, acceptance limits ±
              {settings.accuracyLambdaPct ?? DEFAULT_ACCURACY_LAMBDA_PCT} %; coverage factor k ={' '}
              {settings.coverageFactor ?? DEFAULT_COVERAGE_FACTOR}
            </DataList.ItemValue>
          </DataList.Item>
          <DataList.Item>
            <DataList.ItemLabel>Release of studies</DataList.ItemLabel>
            <DataList.ItemValue>
              {settings.requiresQualityRelease ? 'A quality manager releases after review' : 'Approval by the reviewer is enough'}
            </DataList.ItemValue>
          </DataList.Item>
        </DataList.Root>
        <CriteriaList
          criteria={version.criteria}
          label={`Acceptance criteria of version ${version.number}`}
          units={{ x: method.xUnit, y: method.yUnit }}
        />
      </Stack>
    </Box>
  );
}
