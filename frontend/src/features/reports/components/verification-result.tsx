import { Alert, Code, DataList, Stack, Text } from '@chakra-ui/react';
import { formatDateTime } from '@/lib/format';
import type { ReportVerification } from '../api/verify-report';

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
  const qualification = 'kind' in verification;
  const rows: [string, string][] = qualification
    ? [
        ['Report', 'Self-qualification of the calculations'],
        ['Checks passed', `${verification.passed} of ${verification.total}`],
        ['Signed', formatDateTime(verification.signedAt)],
        ['Report id', verification.qualificationId],
      ]
    : [
        ['Study', verification.studyTitle],
        ['Method', verification.methodName],
        ['Method version', `Version ${verification.methodVersion}`],
        ['Signed', formatDateTime(verification.signedAt)],
        ['Report id', verification.reportId],
        ['Study id', verification.studyId],
      ];
  return (
    <Alert.Root status="success" variant="surface" alignItems="flex-start">
      <Alert.Indicator />
      <Stack gap="3" flex="1" minW="0">
        <Alert.Title>Valid: “{fileName}” is an authentic report, unchanged since it was signed</Alert.Title>
        <Alert.Description>
          <Stack gap="4">
            <Text>
              This file is, byte for byte, the {qualification ? 'self-qualification report' : 'validation report'} this laboratory issued
              and signed. Its digital signature can also be checked in any PDF reader that shows signatures.
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
