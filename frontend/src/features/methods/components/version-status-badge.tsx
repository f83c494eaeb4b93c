import { Badge } from '@chakra-ui/react';
import type { MethodVersionStatus } from '@meritline/shared';

const STATUS: Record<MethodVersionStatus, { label: string; palette: string; hint: string }> = {
  draft: { label: 'Draft', palette: 'accent', hint: 'Being prepared: criteria and settings may still change.' },
  active: { label: 'Active', palette: 'brand', hint: 'In force: new studies and routine batches use it.' },
  retired: { label: 'Retired', palette: 'gray', hint: 'Kept for the record: no new studies can use it.' },
};

export function versionStatusHint(status: MethodVersionStatus): string {
  return STATUS[status].hint;
}

export function VersionStatusBadge({ status }: { status: MethodVersionStatus }) {
  const { label, palette, hint } = STATUS[status];
  return (
    <Badge colorPalette={palette} variant={status === 'active' ? 'solid' : 'subtle'} title={hint}>
      {label}
    </Badge>
  );
}
