import { Table, Text } from '@chakra-ui/react';
import { formatSignificant, type PreparationPreviewDto } from '@meritline/shared';

const PARTS_OF_VOLUME = ['volumeCalibration', 'volumeRepeatability', 'volumeTemperature'];

function unitOf(quantity: string, massUnit: string): string {
  if (quantity === 'purity') return 'g/g';
  if (quantity === 'mass') return massUnit;
  return 'mL';
}

const percent = (x: number) => `${formatSignificant(x * 100, 2)} %`;

/** The stock's uncertainty budget: each input, its u, and what it adds to u(c). */
export function BudgetTable({ stock, massUnit }: { stock: PreparationPreviewDto['stock']; massUnit: string }) {
  const total = stock.u * stock.u;
  return (
    <Table.Root size="sm" aria-label="Uncertainty budget of the stock solution">
      <Table.Header>
        <Table.Row>
          <Table.ColumnHeader>Input</Table.ColumnHeader>
          <Table.ColumnHeader textAlign="end">Value</Table.ColumnHeader>
          <Table.ColumnHeader textAlign="end">u</Table.ColumnHeader>
          <Table.ColumnHeader textAlign="end">u relative</Table.ColumnHeader>
          <Table.ColumnHeader textAlign="end">Contribution to u(c)</Table.ColumnHeader>
          <Table.ColumnHeader textAlign="end">Share of u(c)²</Table.ColumnHeader>
        </Table.Row>
      </Table.Header>
      <Table.Body>
        {stock.budget.map((row) => {
          const part = PARTS_OF_VOLUME.includes(row.quantity);
          const unit = unitOf(row.quantity, massUnit);
          return (
            <Table.Row key={row.quantity} color={part ? 'fg.muted' : undefined}>
              <Table.Cell ps={part ? '6' : undefined}>{row.label}</Table.Cell>
              <Table.Cell textAlign="end">{part ? '' : `${row.value} ${unit}`}</Table.Cell>
              <Table.Cell textAlign="end">
                {formatSignificant(row.u, 2)} {unit}
              </Table.Cell>
              <Table.Cell textAlign="end">{percent(row.relativeU)}</Table.Cell>
              <Table.Cell textAlign="end">
                {formatSignificant(row.contribution, 2)} {stock.unit}
              </Table.Cell>
              <Table.Cell textAlign="end">{total > 0 && !part ? percent((row.contribution * row.contribution) / total) : ''}</Table.Cell>
            </Table.Row>
          );
        })}
      </Table.Body>
      <Table.Footer>
        <Table.Row fontWeight="600">
          <Table.Cell colSpan={4}>
            <Text>Combined standard uncertainty u(c)</Text>
          </Table.Cell>
          <Table.Cell textAlign="end">
            {formatSignificant(stock.u, 2)} {stock.unit}
          </Table.Cell>
          <Table.Cell textAlign="end">{percent(stock.relativeU)} of c</Table.Cell>
        </Table.Row>
      </Table.Footer>
    </Table.Root>
  );
}
