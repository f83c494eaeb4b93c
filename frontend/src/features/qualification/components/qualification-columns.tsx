import { formatDateTime, type QualificationRunDto } from '@meritline/shared';
import { Badge, Button, Stack, Text } from '@chakra-ui/react';
import { useState } from 'react';
import { dataTableColumns } from '@/components/data-table';
import { toaster } from '@/components/ui/toaster';
import { isApiError } from '@/lib/api-client';
import { downloadQualificationReport } from '../api/qualification-queries';

const column = dataTableColumns<QualificationRunDto>();

export const digitsText = (digits: number | null) => (digits === null ? '—' : digits >= 15 ? '15 (all)' : digits.toFixed(1));

function ReportButton({ run }: { run: QualificationRunDto }) {
  const [busy, setBusy] = useState(false);
  return (
    <Button
      size="xs"
      variant="outline"
      loading={busy}
      onClick={() => {
        setBusy(true);
        downloadQualificationReport(run.id)
          .catch((error: unknown) =>
            toaster.create({ type: 'error', title: 'The download failed', description: isApiError(error) ? error.message : String(error) }),
          )
          .finally(() => setBusy(false));
      }}
    >
      Signed report
    </Button>
  );
}

export const qualificationColumns = column.columns([
  column.accessor('ranAt', { header: 'Run', cell: (info) => <Text whiteSpace="nowrap">{formatDateTime(info.getValue())}</Text> }),
  column.accessor('ranByName', { header: 'By' }),
  column.accessor('allPassed', {
    header: 'Verdict',
    cell: (info) => (
      <Badge colorPalette={info.getValue() ? 'green' : 'red'} size="md">
        {info.getValue() ? 'All checks passed' : `${info.row.original.failed} failed`}
      </Badge>
    ),
  }),
  column.accessor('passed', {
    header: 'Passed',
    meta: { align: 'end' },
    cell: (info) => `${info.getValue()} of ${info.row.original.total}`,
  }),
  column.accessor('minDigits', { header: 'Fewest digits', meta: { align: 'end' }, cell: (info) => digitsText(info.getValue()) }),
  column.accessor((run) => run.installation, {
    id: 'installation',
    header: 'Installation',
    cell: (info) => (
      <Stack gap="0" fontSize="sm">
        <Text>
          Product {info.getValue().productVersion}, engine {info.getValue().engineVersion}
        </Text>
        <Text color="fg.muted">
          Node.js {info.getValue().nodeVersion}, {info.getValue().databaseKind}
        </Text>
      </Stack>
    ),
  }),
  column.display({ id: 'report', header: 'Report', cell: (info) => <ReportButton run={info.row.original} /> }),
]);
