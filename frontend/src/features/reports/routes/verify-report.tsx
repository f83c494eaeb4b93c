import { MAX_REPORT_BYTES } from '@meritline/shared';
import { Alert, Box, FileUpload, Heading, Icon, Stack, Text } from '@chakra-ui/react';
import { useState } from 'react';
import { isApiError } from '@/lib/api-client';
import { useVerifyReport } from '../api/verify-report';
import { PublicPage } from '../components/public-page';
import { VerificationResult } from '../components/verification-result';

const TITLE = 'Verify a report';

function UploadIcon() {
  return (
    <Icon boxSize="8" color="brand.fg" aria-hidden="true">
      <svg viewBox="0 0 24 24" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round">
        <path d="M14 3H7a2 2 0 0 0-2 2v14a2 2 0 0 0 2 2h10a2 2 0 0 0 2-2V8z" />
        <path d="M14 3v5h5M12 17v-6M9.5 13.5 12 11l2.5 2.5" />
      </svg>
    </Icon>
  );
}

export default function VerifyReportPage() {
  const verify = useVerifyReport();
  const [fileName, setFileName] = useState<string | null>(null);
  const [rejection, setRejection] = useState<string | null>(null);

  const check = (file: File) => {
    setRejection(null);
    setFileName(file.name);
    verify.mutate(file);
  };

  return (
    <PublicPage title={TITLE}>
      <Stack gap="8">
        <Stack gap="2" maxW="3xl">
          <Text textStyle="sectionLabel" color="accent.fg">
            Reports
          </Text>
          <Heading as="h1" size="2xl" fontWeight="600" letterSpacing="-0.01em">
            {TITLE}
          </Heading>
          <Text color="fg.muted" fontSize="md">
            Check that a signed Meritline validation report or results report is authentic and has not been changed since it was signed. The
            file is compared with the reports this laboratory issued; it is not stored. No account is needed.
          </Text>
        </Stack>

        <FileUpload.Root
          maxFiles={1}
          maxFileSize={MAX_REPORT_BYTES}
          accept={['application/pdf', '.pdf']}
          onFileAccept={(details) => details.files[0] && check(details.files[0])}
          onFileReject={(details) => {
            const error = details.files[0]?.errors[0];
            setFileName(details.files[0]?.file.name ?? null);
            setRejection(
              error === 'FILE_TOO_LARGE'
                ? 'The file is larger than 20 MB, so it cannot be a Meritline report.'
                : 'Choose a PDF file: a Meritline report is a PDF.',
            );
          }}
        >
          <FileUpload.HiddenInput aria-label="Report to verify (PDF)" />
          <FileUpload.Dropzone
            w="full"
            minH="44"
            borderWidth="2px"
            borderStyle="dashed"
            borderColor="border.emphasized"
            bg="bg.panel"
            cursor="pointer"
          >
            <UploadIcon />
            <FileUpload.DropzoneContent>
              <Box fontWeight="600">Drop the report here, or click to choose it</Box>
              <Box color="fg.muted">One PDF file, at most 20 MB</Box>
            </FileUpload.DropzoneContent>
          </FileUpload.Dropzone>
        </FileUpload.Root>

        <Box aria-live="polite">
          {verify.isPending && <Text color="fg.muted">Checking “{fileName}”…</Text>}
          {rejection && (
            <Alert.Root status="warning" variant="surface">
              <Alert.Indicator />
              <Alert.Title>{rejection}</Alert.Title>
            </Alert.Root>
          )}
          {!rejection && verify.isError && (
            <Alert.Root status="error" variant="surface">
              <Alert.Indicator />
              <Alert.Title>
                {isApiError(verify.error) ? verify.error.body.message : 'The file could not be checked. Try again.'}
              </Alert.Title>
            </Alert.Root>
          )}
          {!rejection && verify.isSuccess && fileName && <VerificationResult fileName={fileName} verification={verify.data} />}
        </Box>

        <Text fontSize="sm" color="fg.muted" maxW="3xl">
          A valid answer says the file is exactly the report Meritline issued. It does not replace the laboratory’s procedures, qualified
          review or the regulations that apply to the results.
        </Text>
      </Stack>
    </PublicPage>
  );
}
