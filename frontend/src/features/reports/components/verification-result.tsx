import { formatDateTime, type ReportVerification } from '@meritline/shared';
import { Alert, Code, DataList, Stack, Text } from '@chakra-ui/react';

type Valid = Extract<ReportVerification, { valid: true }>;

/** Which document it is, and the facts that identify it. */
function describeReport(verification: Valid): { document: string; rows: [string, string][] } {
  const signed: [string, string] = ['Signed', formatDateTime(verification.signedAt)];
  switch (verification.kind) {
    case 'self-qualification':
      return {
        document: 'self-qualification report',
        rows: [
          ['Report', 'Self-qualification of the calculations'],
          ['Checks passed', `${verification.passed} of ${verification.total}`],
          signed,
          ['Report id', verification.qualificationId],
        ],
      };
    case 'results-report':
      return {
        document: 'results report of a released routine run',
        rows: [
          ['Routine run', verification.runTitle],
          ['Method', verification.methodName],
          ['Method version', `Version ${verification.methodVersion}`],
          signed,
          ['Report id', verification.reportId],
          ['Run id', verification.runId],
        ],
      };
    default: {
      const assessment = verification.kind === 'change-assessment';
      return {
        document: assessment ? 'change assessment' : 'validation report',
        rows: [
          [assessment ? 'Document' : 'Study', verification.studyTitle],
          ['Method', verification.methodName],
          ['Method version', `Version ${verification.methodVersion}`],
          signed,
          [assessment ? 'Assessment id' : 'Report id', verification.reportId],
          [assessment ? 'Study of the version' : 'Study id', verification.studyId],
        ],
      };
    }
  }
}

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
  const { document, rows } = describeReport(verification);
  return (
    <Alert.Root status="success" variant="surface" alignItems="flex-start">
      <Alert.Indicator />
      <Stack gap="3" flex="1" minW="0">
        <Alert.Title>Valid: “{fileName}” is an authentic report, unchanged since it was signed</Alert.Title>
        <Alert.Description>
          <Stack gap="4">
            <Text>
              This file is, byte for byte, the {document} this laboratory issued and signed. Its digital signature can also be checked in
              any PDF reader that shows signatures.
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
