import { formatDateTime } from '@meritline/shared';
import type { ReportVerification } from '@meritline/shared';
import { Alert, Code, DataList, Stack, Text } from '@chakra-ui/react';

/** The answer in plain words: which report it is, or why the file cannot be trusted. */
export function VerificationResult({ fileName, verification }: { fileName: string; verification: ReportVerification }) {
  if (!verification.valid) {
    return (
      <Alert.Root status="error" variant="surface" alignItems="flex-start">
        <Alert.Indicator />
        <Stack gap="2">
          <Alert.Title>Not valid: “{fileName}” is not an unchanged Meritline report</Alert.Title>
          <Alert.Description>
            <Stack gap="2">
              <Text>{verification.reason}</Text>
              <Text>
                What this means: do not rely on the figures in this file. Ask the laboratory for the original report, or download it again
                from Meritline.
              </Text>
            </Stack>
          </Alert.Description>
        </Stack>
      </Alert.Root>
    );
  }
  const assessment = verification.kind === 'change-assessment';
  const results = verification.kind === 'results-report';
  const rows: [string, string][] = [
    results ? ['Routine run', verification.runTitle] : [assessment ? 'Document' : 'Study', verification.studyTitle],
    ['Method', verification.methodName],
    ['Method version', `Version ${verification.methodVersion}`],
    ['Signed', formatDateTime(verification.signedAt)],
    [assessment ? 'Assessment id' : 'Report id', verification.reportId],
    ...(results
      ? [['Run id', verification.runId] as [string, string]]
      : verification.studyId
        ? [[assessment ? 'Study of the version' : 'Study id', verification.studyId] as [string, string]]
        : []),
  ];
  return (
    <Alert.Root status="success" variant="surface" alignItems="flex-start">
      <Alert.Indicator />
      <Stack gap="3" flex="1" minW="0">
        <Alert.Title>Valid: “{fileName}” is an authentic report, unchanged since it was signed</Alert.Title>
        <Alert.Description>
          <Stack gap="4">
            <Text>
              This file is, byte for byte, the{' '}
              {results ? 'results report of a released routine run' : assessment ? 'change assessment' : 'validation report'} this
              laboratory issued and signed. Its digital signature can also be checked in any PDF reader that shows signatures.
            </Text>
            <DataList.Root orientation="horizontal" size="sm">
              {rows.map(([label, value]) => (
                <DataList.Item key={label}>
                  <DataList.ItemLabel minW="32">{label}</DataList.ItemLabel>
                  <DataList.ItemValue wordBreak="break-word">{value}</DataList.ItemValue>
                </DataList.Item>
              ))}
              <DataList.Item>
                <DataList.ItemLabel minW="32">SHA-256 of the file</DataList.ItemLabel>
                <DataList.ItemValue minW="0">
                  <Code size="sm" wordBreak="break-all" whiteSpace="normal">
                    {verification.sha256}
                  </Code>
                </DataList.ItemValue>
              </DataList.Item>
            </DataList.Root>
          </Stack>
        </Alert.Description>
      </Stack>
    </Alert.Root>
  );
}
