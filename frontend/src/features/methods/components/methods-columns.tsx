import type { MethodDto } from '@meritline/shared';
import { Badge, HStack, Text } from '@chakra-ui/react';
import { dataTableColumns } from '@/components/data-table';
import { NameCell } from '@/components/name-cell';
import { paths } from '@/lib/config/paths';
import { VersionStatusBadge } from './version-status-badge';

const column = dataTableColumns<MethodDto>();

export const methodsColumns = column.columns([
  column.accessor('name', {
    header: 'Method',
    sortFn: 'text',
    cell: (info) => (
      <NameCell
        name={info.getValue()}
        href={paths.methodDetail.getHref(info.row.original.id)}
        detail={`${info.row.original.analyte} in ${info.row.original.matrix}`}
      />
    ),
  }),
  column.accessor('technique', {
    header: 'Technique',
    sortFn: 'text',
    cell: (info) => (
      <Text whiteSpace="normal" minW="12rem" maxW="22rem">
        {info.getValue()}
      </Text>
    ),
  }),
  column.accessor((m) => `${m.xUnit} / ${m.yUnit}`, { id: 'units', header: 'Units (x / y)', enableSorting: false }),
  column.accessor((m) => Math.max(0, ...m.versions.map((v) => v.number)), {
    id: 'versions',
    header: 'Versions',
    sortFn: 'basic',
    cell: (info) => {
      const versions = [...info.row.original.versions].sort((a, b) => b.number - a.number);
      const active = versions.find((v) => v.status === 'active');
      const drafts = versions.filter((v) => v.status === 'draft').length;
      return (
        <HStack gap="2" wrap="wrap">
          {active ? (
            <HStack gap="1.5">
              <Text as="span">v{active.number}</Text>
              <VersionStatusBadge status="active" />
            </HStack>
          ) : (
            <Text as="span" color="fg.muted">
              None active
            </Text>
          )}
          {drafts > 0 && (
            <Badge variant="outline" colorPalette="accent">
              {drafts} draft{drafts > 1 ? 's' : ''}
            </Badge>
          )}
        </HStack>
      );
    },
  }),
  column.accessor((m) => m.versions.reduce((sum, v) => sum + v.studyCount, 0), {
    id: 'studies',
    header: 'Studies',
    sortFn: 'basic',
    meta: { align: 'end' },
  }),
]);
