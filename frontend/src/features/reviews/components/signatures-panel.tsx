import { Alert, Badge, Box, Code, HStack, Stack, Text } from '@chakra-ui/react';
import { ROLE_LABELS, formatDateTime } from '@meritline/shared';
import { MEANING_LABELS, type Signature } from '../api/review-types';

const utc = (iso: string) => `${iso.slice(0, 16).replace('T', ' ')} UTC`;

export function brokenSignatures(signatures: readonly Signature[]) {
  return signatures.filter((signature) => !signature.valid);
}

/** A warning that cannot be missed: the study no longer matches what someone signed. */
export function BrokenSignatureWarning({ signatures }: { signatures: readonly Signature[] }) {
  const broken = brokenSignatures(signatures);
  if (!broken.length) return null;
  return (
    <Alert.Root status="error" variant="solid" data-testid="broken-signature-warning">
      <Alert.Indicator />
      <Alert.Content>
        <Alert.Title>Broken signature{broken.length > 1 ? 's' : ''}: the study changed after it was signed</Alert.Title>
        <Alert.Description>
          The data or results no longer match what {[...new Set(broken.map((s) => s.signerName))].join(' and ')} signed. Do not rely on this
          study; ask the quality manager to investigate the audit trail.
        </Alert.Description>
      </Alert.Content>
    </Alert.Root>
  );
}

export function SignaturesPanel({ signatures }: { signatures: readonly Signature[] }) {
  if (!signatures.length) return <Text color="fg.muted">Nobody has signed this study yet.</Text>;
  return (
    <Stack gap="3" as="ol" listStyleType="none">
      {signatures.map((signature) => (
        <Box
          as="li"
          key={signature.id}
          p="4"
          borderWidth="1px"
          borderRadius="l3"
          borderColor={signature.valid ? 'border' : 'red.solid'}
          bg={signature.valid ? 'bg.panel' : 'red.subtle'}
          opacity={signature.superseded ? 0.75 : 1}
          data-testid="signature"
        >
          <HStack justify="space-between" align="flex-start" wrap="wrap" gap="2">
            <Stack gap="0.5">
              <Text fontWeight="600">{MEANING_LABELS[signature.meaning]}</Text>
              <Text fontSize="sm">
                {signature.signerName} · signed as {ROLE_LABELS[signature.signerRole] ?? signature.signerRole}
              </Text>
              <Text fontSize="sm" color="fg.muted" title={formatDateTime(signature.signedAt)}>
                {utc(signature.signedAt)}
              </Text>
            </Stack>
            <HStack gap="2">
              {signature.superseded && <Badge colorPalette="gray">Earlier submission</Badge>}
              {signature.valid ? (
                <Badge colorPalette="green" variant="subtle">
                  Intact
                </Badge>
              ) : (
                <Badge colorPalette="red" variant="solid">
                  Broken: content changed
                </Badge>
              )}
            </HStack>
          </HStack>
          {signature.comment && (
            <Text mt="2" fontSize="sm" whiteSpace="pre-wrap">
              “{signature.comment}”
            </Text>
          )}
          <Text mt="2" fontSize="xs" color="fg.muted">
            Content fingerprint (SHA-256) <Code fontSize="xs">{signature.contentHash.slice(0, 16)}…</Code>
          </Text>
        </Box>
      ))}
    </Stack>
  );
}
