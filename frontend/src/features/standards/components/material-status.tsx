import { Badge, HStack, Text } from '@chakra-ui/react';
import { REFERENCE_MATERIAL_STATUS_LABELS, type ReferenceMaterialDto } from '@meritline/shared';

const PALETTE = { 'in-use': 'brand', expired: 'red', withdrawn: 'gray' } as const;

export function expiryWords(m: Pick<ReferenceMaterialDto, 'daysToExpiry' | 'status'>): string {
  const d = m.daysToExpiry;
  if (d < 0) return `expired ${-d} day${d === -1 ? '' : 's'} ago`;
  if (d === 0) return 'last day of use today';
  return `expires in ${d} day${d === 1 ? '' : 's'}`;
}

export function MaterialStatus({ material }: { material: ReferenceMaterialDto }) {
  return (
    <HStack gap="2" wrap="wrap">
      <Badge colorPalette={PALETTE[material.status]} variant={material.status === 'in-use' ? 'subtle' : 'solid'}>
        {REFERENCE_MATERIAL_STATUS_LABELS[material.status]}
      </Badge>
      {material.expiringSoon && (
        <Badge colorPalette="orange" variant="solid">
          Expires soon
        </Badge>
      )}
      {material.status !== 'withdrawn' && (
        <Text as="span" fontSize="sm" color={material.expiringSoon || material.status === 'expired' ? 'orange.fg' : 'fg.muted'}>
          {expiryWords(material)}
        </Text>
      )}
    </HStack>
  );
}
