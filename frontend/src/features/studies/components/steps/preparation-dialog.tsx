import { formatEstimate, type PreparationDto } from '@meritline/shared';
import { Alert, Button, Spinner, Stack, Table, Text } from '@chakra-ui/react';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { DialogCancel, DialogShell } from '@/components/dialog-shell';
import { FillModeChoice, type FillMode } from '../grid/fill-mode-choice';
import { preparationChoicesQueries } from '../../api/preparation-choices-queries';
import type { GridRow } from '../../utils/grid-sections';
import { standardsFromPreparation } from '../../utils/preparation-standards';

export interface PreparationDialogProps {
  xUnit: string | undefined;
  /** Standards rows already holding something. */
  filledRows: number;
  onFill: (rows: GridRow[], mode: FillMode) => void;
  disabled?: boolean;
}

const materialWords = (p: PreparationDto) => (p.material ? `${p.material.name}, lot ${p.material.lot}` : 'Purity entered by hand');

/** Choose a saved standard preparation; its working standards become the rows of the standards grid. */
export function PreparationDialog({ xUnit, filledRows, onFill, disabled }: PreparationDialogProps) {
  const [open, setOpen] = useState(false);
  const [chosen, setChosen] = useState<PreparationDto | null>(null);
  const [mode, setMode] = useState<FillMode>('replace');
  const preparations = useQuery({ ...preparationChoicesQueries.list(), enabled: open });
  const fill = chosen ? standardsFromPreparation(chosen, xUnit) : null;

  const close = () => {
    setOpen(false);
    setChosen(null);
    setMode('replace');
  };

  return (
    <DialogShell
      open={open}
      onOpenChange={(next) => (next ? setOpen(true) : close())}
      size="xl"
      trigger={
        <Button size="sm" variant="outline" disabled={disabled}>
          Take concentrations from a preparation
        </Button>
      }
      title={'Take concentrations from a preparation'}
      footer={
        <>
          <DialogCancel />
          <Button
            disabled={!fill || !('rows' in fill)}
            onClick={() => {
              if (!fill || !('rows' in fill)) return;
              onFill(fill.rows, filledRows > 0 ? mode : 'replace');
              close();
            }}
          >
            {fill && 'rows' in fill
              ? `Put ${fill.rows.length} standard${fill.rows.length === 1 ? '' : 's'} in the grid`
              : 'Put the standards in the grid'}
          </Button>
        </>
      }
    >
      <Stack gap="4">
        <Text color="fg.muted" fontSize="sm">
          Each working standard of the preparation becomes one row, its concentration filled in; you enter the responses.
        </Text>
        {preparations.isPending ? (
          <Spinner size="sm" aria-label="Loading the preparations" />
        ) : preparations.isError ? (
          <Text color="fg.error">The saved preparations could not be loaded.</Text>
        ) : preparations.data.length === 0 ? (
          <Text>No preparation is saved yet. Prepare standards first, under Standard preparations.</Text>
        ) : (
          <Table.ScrollArea borderWidth="1px" borderColor="border" borderRadius="l2" maxH="72">
            <Table.Root size="sm" aria-label="Saved preparations">
              <Table.Header>
                <Table.Row>
                  <Table.ColumnHeader>Preparation</Table.ColumnHeader>
                  <Table.ColumnHeader>Material</Table.ColumnHeader>
                  <Table.ColumnHeader>Working standards (concentration ± u)</Table.ColumnHeader>
                  <Table.ColumnHeader />
                </Table.Row>
              </Table.Header>
              <Table.Body>
                {preparations.data.map((p) => (
                  <Table.Row key={p.id} bg={chosen?.id === p.id ? 'bg.emphasized' : undefined}>
                    <Table.Cell fontWeight="medium" whiteSpace="normal" minW="10rem">
                      {p.name}
                    </Table.Cell>
                    <Table.Cell whiteSpace="normal">{materialWords(p)}</Table.Cell>
                    <Table.Cell whiteSpace="normal">
                      {p.result.steps.length === 0
                        ? 'None'
                        : p.result.steps
                            .map((s) => {
                              const e = formatEstimate(s.concentration, s.u);
                              return `${e.value} (u ${e.uncertainty}) ${p.result.stock.unit}`;
                            })
                            .join('; ')}
                    </Table.Cell>
                    <Table.Cell textAlign="end">
                      <Button
                        size="xs"
                        variant={chosen?.id === p.id ? 'solid' : 'outline'}
                        aria-label={`Choose ${p.name}`}
                        aria-pressed={chosen?.id === p.id}
                        onClick={() => setChosen(p)}
                      >
                        {chosen?.id === p.id ? 'Chosen' : 'Choose'}
                      </Button>
                    </Table.Cell>
                  </Table.Row>
                ))}
              </Table.Body>
            </Table.Root>
          </Table.ScrollArea>
        )}
        {fill && 'refusal' in fill && (
          <Alert.Root status="warning">
            <Alert.Indicator />
            <Alert.Description>{fill.refusal}</Alert.Description>
          </Alert.Root>
        )}
        {fill && 'rows' in fill && filledRows > 0 && (
          <Stack gap="2">
            <Text fontSize="sm">
              The grid already holds {filledRows} row{filledRows === 1 ? '' : 's'}. Keep {filledRows === 1 ? 'it' : 'them'} or replace{' '}
              {filledRows === 1 ? 'it' : 'them'}?
            </Text>
            <FillModeChoice value={mode} onChange={setMode} appendLabel={'Keep them and add after'} />
          </Stack>
        )}
      </Stack>
    </DialogShell>
  );
}
